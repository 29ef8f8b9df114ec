import { TableScroll } from '@/components/ui/table';
import { comparisonGroups, type ComparedCam } from '@/lib/shortlist/comparison';
import { customerCamName } from '@/lib/shortlist/customer-words';

// The chosen cams side by side, one column each. The staff page shows it in its own dense type; the
// customer view passes `forCustomer` (large type, grind names without the shop's SKU). Every cell is text
// made by lib/shortlist/comparison.ts from the ranking. The row labels stay put while a phone scrolls the
// cams sideways.
export function CamComparison({
  cams,
  forCustomer = false,
  caption,
}: {
  cams: readonly ComparedCam[];
  forCustomer?: boolean;
  caption: string;
}) {
  const large = forCustomer;
  const groups = comparisonGroups(cams);
  const cell = large ? 'px-3 py-2.5' : 'px-2 py-1.5';
  return (
    <TableScroll label={caption}>
      <table className={`w-full border-collapse tabular-nums ${large ? 'text-lg' : 'text-sm'}`} data-comparison>
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="bg-paper-sunk">
            <td className={`${cell} sticky left-0 bg-paper-sunk`} />
            {cams.map((cam) => (
              <th key={String(cam.camId)} scope="col" className={`${cell} min-w-40 text-left font-semibold`}>
                {forCustomer ? customerCamName(cam) : cam.camName}
              </th>
            ))}
          </tr>
        </thead>
        {groups.map((group) => (
          <tbody key={group.key}>
            <tr>
              <th
                scope="colgroup"
                colSpan={cams.length + 1}
                className={`${cell} border-t border-steel-300 text-left ${large ? 'text-base' : 'text-xs uppercase tracking-wide'} font-semibold text-ink-muted`}
              >
                {group.title}
              </th>
            </tr>
            {group.rows.map((row) => (
              <tr key={row.key} data-row={row.key} className="border-t border-steel-100 align-top">
                <th
                  scope="row"
                  className={`${cell} sticky left-0 max-w-44 bg-paper-raised text-left font-normal text-ink-soft`}
                >
                  {row.label}
                </th>
                {row.values.map((value, i) => (
                  <td key={i} className={`${cell} ${row.key === 'price' ? 'font-semibold' : ''}`}>
                    {value}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        ))}
      </table>
    </TableScroll>
  );
}
