import type { Metadata } from 'next';
import Link from 'next/link';
import { formatMoney } from '@/lib/format';
import { Banner } from '@/components/ui/banner';
import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { StateTag } from '@/components/ui/state-tag';
import { tableClass, TableScroll, tdClass, thClass } from '@/components/ui/table';
import { requireAccessForPage } from '@/lib/auth/guard';
import { can } from '@/lib/auth/policy';
import { listLabor } from '@/lib/db/queries/labor';
import { getShopSettingsRecord } from '@/lib/db/queries/settings';
import { LaborListQuerySchema } from '@/lib/schemas/labor';

export const metadata: Metadata = { title: 'Labour' };

export default async function LaborPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | undefined>>;
}) {
  const user = await requireAccessForPage('catalogue.read');
  const raw = await searchParams;
  const [{ items, total }, settings] = await Promise.all([
    listLabor(LaborListQuerySchema.parse({ pageSize: '200' })),
    getShopSettingsRecord(),
  ]);
  const manager = can(user, 'catalogue.write');
  const rate = settings?.laborRateCents ?? 0;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Labour operations"
        lead={`Priced at the shop's labour rate, ${formatMoney(rate)} per hour.`}
        back={{ href: '/catalogue', label: 'Catalogue' }}
        actions={
          manager ? (
            <ButtonLink href="/catalogue/labor/new" variant="primary">
              Add an operation
            </ButtonLink>
          ) : null
        }
      />
      {raw.saved ? <Banner tone="ok" title="Labour operation saved" /> : null}
      {raw.deleted ? <Banner tone="ok" title="Labour operation deleted" /> : null}
      {raw.deactivated ? (
        <Banner tone="info" title="Labour operation switched off">
          Quotes refer to it, so it was kept and made inactive.
        </Banner>
      ) : null}
      <TableScroll label="Labour operations">
        <table className={tableClass}>
          <thead>
            <tr>
              <th className={thClass}>Code</th>
              <th className={thClass}>Name</th>
              <th className={`${thClass} text-right`}>Hours</th>
              <th className={`${thClass} text-right`}>At the rate</th>
              <th className={thClass}>Engines</th>
              <th className={thClass}>State</th>
              {manager ? (
                <th className={thClass}>
                  <span className="sr-only">Actions</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {items.map((op) => (
              <tr key={op.id}>
                <td className={`${tdClass} spec`}>{op.code}</td>
                <td className={tdClass}>{op.name}</td>
                <td className={`${tdClass} spec text-right`}>{op.hours.toFixed(2)} h</td>
                <td className={`${tdClass} spec text-right`}>{formatMoney(Math.round(op.hours * rate))}</td>
                <td className={tdClass}>{op.engines}</td>
                <td className={tdClass}>
                  {op.active ? <StateTag tone="ok">Active</StateTag> : <StateTag tone="caution">Inactive</StateTag>}
                </td>
                {manager ? (
                  <td className={tdClass}>
                    <Link className="text-gauge-700 underline" href={`/catalogue/labor/${op.id}/edit`}>
                      Edit
                    </Link>
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
        {items.length === 0 ? <p className="p-4 text-sm text-ink-soft">No labour operations yet.</p> : null}
      </TableScroll>
      <p className="text-xs text-ink-muted tabular-nums">{total} operation(s)</p>
    </div>
  );
}
