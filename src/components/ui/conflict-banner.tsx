import { Banner } from './banner';
import { Button } from './button';

// What a page shows when its save came back 409 (useVersionedSave's `conflict`): the newer record, told in
// `children`, and the two ways on: load theirs, or keep what was typed and save it on top of their version.
// Nothing was overwritten, and the title says so.
export function ConflictBanner({
  title,
  children,
  onTheirs,
  onMine,
  theirsLabel = 'Load their version',
  mineLabel = 'Keep mine (then save again)',
}: {
  title: string;
  children?: React.ReactNode;
  onTheirs: () => void;
  onMine: () => void;
  theirsLabel?: string;
  mineLabel?: string;
}) {
  return (
    <Banner tone="caution" title={title}>
      {children}
      <div className="mt-2 flex flex-wrap gap-2">
        <Button type="button" variant="quiet" onClick={onTheirs}>
          {theirsLabel}
        </Button>
        <Button type="button" variant="quiet" onClick={onMine}>
          {mineLabel}
        </Button>
      </div>
    </Banner>
  );
}
