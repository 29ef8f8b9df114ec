import type { Metadata } from 'next';
import Link from 'next/link';
import { Banner } from '@/components/ui/banner';
import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { StateTag } from '@/components/ui/state-tag';
import { requireAccessForPage } from '@/lib/auth/guard';
import { can } from '@/lib/auth/policy';
import { listRules } from '@/lib/db/queries/rules';
import { unmappedKinds } from '@/lib/catalogue/need-rules';
import { VEHICLE_CLASSES } from '@/lib/schemas/build-profile';
import { NEED_RULE_KIND_TEXT, RULE_VEHICLE_CLASS_TEXT } from '@/lib/schemas/need-rule';

export const metadata: Metadata = { title: 'What a cam needs' };

export default async function RulesPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | undefined>>;
}) {
  const user = await requireAccessForPage('catalogue.read');
  const raw = await searchParams;
  const rules = await listRules();
  const manager = can(user, 'catalogue.write');
  const active = rules.filter((r) => r.active);
  // Installing and tuning are part of every job: say plainly which vehicle classes would be quoted without them.
  const gaps = VEHICLE_CLASSES.flatMap((vc) =>
    unmappedKinds(active, vc)
      .filter((kind) => kind === 'install' || kind === 'tune')
      .map((kind) => `${RULE_VEHICLE_CLASS_TEXT[vc]}: ${NEED_RULE_KIND_TEXT[kind].title}`),
  );
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="What a cam needs"
        lead="What each need the advisor names costs in this shop, by vehicle class. The advisor decides when a cam needs springs, a converter or the rest; these rules add the parts and labour, and the shortlist and the quote price the job from them."
        back={{ href: '/catalogue', label: 'Catalogue' }}
        actions={
          manager ? (
            <ButtonLink href="/catalogue/rules/new" variant="primary">
              Add a rule
            </ButtonLink>
          ) : null
        }
      />
      {raw.saved ? <Banner tone="ok" title="Rule saved" /> : null}
      {raw.deleted ? <Banner tone="ok" title="Rule deleted" /> : null}
      {gaps.length ? (
        <Banner tone="caution" title="Needs without a rule">
          <ul className="list-disc pl-5">
            {gaps.map((gap) => (
              <li key={gap}>{gap}</li>
            ))}
          </ul>
          <p className="mt-1">
            Jobs that need these are priced and quoted without them until a rule says what they add.
          </p>
        </Banner>
      ) : null}
      {rules.length === 0 ? (
        <p className="text-sm text-ink-soft">No rules yet: quotes will carry only what staff add by hand.</p>
      ) : null}
      <ol className="flex flex-col gap-3">
        {rules.map((rule) => {
          const kind = NEED_RULE_KIND_TEXT[rule.kind];
          return (
            <li key={rule.id} className="rounded border border-steel-300 bg-paper-raised p-3">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <h2 className="font-semibold">{rule.label}</h2>
                <span className="flex items-center gap-2">
                  {rule.active ? <StateTag tone="ok">Active</StateTag> : <StateTag tone="muted">Switched off</StateTag>}
                  {manager ? (
                    <Link className="text-sm text-gauge-700 underline" href={`/catalogue/rules/${rule.id}/edit`}>
                      Edit
                    </Link>
                  ) : null}
                </span>
              </div>
              <p className="text-sm text-ink-soft">
                {kind.title} · {RULE_VEHICLE_CLASS_TEXT[rule.vehicleClass ?? 'any']}
              </p>
              <ul className="mt-2 text-sm">
                {rule.items.map((item, i) => (
                  <li key={i} className="spec">
                    → {item.part ? `${item.part.sku} ${item.part.name}` : null}
                    {item.part && item.laborOperation ? ' + ' : null}
                    {item.laborOperation
                      ? `${item.laborOperation.code} ${item.laborOperation.name} (${item.laborOperation.hours.toFixed(2)} h)`
                      : null}
                    {item.quantity !== 1 ? ` × ${item.quantity}` : null}
                  </li>
                ))}
              </ul>
            </li>
          );
        })}
      </ol>
    </div>
  );
}
