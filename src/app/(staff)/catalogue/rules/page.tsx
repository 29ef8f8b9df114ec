import type { Metadata } from 'next';
import Link from 'next/link';
import { Banner, ButtonLink, PageHeader, StateTag } from '@/components/catalogue/ui';
import { requireRoleForPage } from '@/lib/auth/guard';
import { listRules } from '@/lib/db/queries/rules';
import { NEED_RULE_KIND_TEXT } from '@/lib/schemas/need-rule';

export const metadata: Metadata = { title: 'What a cam needs' };

export default async function RulesPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const user = await requireRoleForPage();
  const raw = await searchParams;
  const rules = await listRules();
  const manager = user.role === 'manager';
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="What a cam needs"
        lead="Plain rules that add parts and labour to a cam swap. The advisor lists them as needs; the quote builder adds them as lines."
        back={{ href: '/catalogue', label: 'Catalogue' }}
        actions={manager ? <ButtonLink href="/catalogue/rules/new" tone="primary">Add a rule</ButtonLink> : null}
      />
      {raw.saved ? <Banner tone="ok" title="Rule saved" /> : null}
      {raw.deleted ? <Banner tone="ok" title="Rule deleted" /> : null}
      {rules.length === 0 ? <p className="text-sm text-ink-soft">No rules yet: quotes will carry only what staff add by hand.</p> : null}
      <ol className="flex flex-col gap-3">
        {rules.map((rule) => {
          const kind = NEED_RULE_KIND_TEXT[rule.kind];
          return (
            <li key={rule.id} className="rounded border border-steel-300 bg-paper-raised p-3">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <h2 className="font-semibold">{rule.label}</h2>
                <span className="flex items-center gap-2">
                  {rule.active ? <StateTag tone="ok">Active</StateTag> : <StateTag tone="muted">Switched off</StateTag>}
                  {manager ? <Link className="text-sm text-gauge-700 underline" href={`/catalogue/rules/${rule.id}/edit`}>Edit</Link> : null}
                </span>
              </div>
              <p className="text-sm text-ink-soft">
                {kind.title.replace(' N ', ` ${rule.threshold ?? 'N'} `)}
                {kind.threshold && rule.threshold !== null ? <span className="spec"> (N = {rule.threshold} {kind.threshold.unit})</span> : null}
              </p>
              <ul className="mt-2 text-sm">
                {rule.items.map((item, i) => (
                  <li key={i} className="spec">
                    → {item.part ? `${item.part.sku} ${item.part.name}` : null}
                    {item.part && item.laborOperation ? ' + ' : null}
                    {item.laborOperation ? `${item.laborOperation.code} ${item.laborOperation.name} (${item.laborOperation.hours.toFixed(2)} h)` : null}
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
