import type { Metadata } from 'next';
import { percentFromBp, formatCents } from '@/components/catalogue/format';
import { SettingsForm } from '@/components/catalogue/record-forms';
import { Banner, PageHeader } from '@/components/catalogue/ui';
import { requireRoleForPage } from '@/lib/auth/guard';
import { getShopSettingsRecord } from '@/lib/db/queries/settings';

export const metadata: Metadata = { title: 'Prices and deposit' };

export default async function SettingsPage() {
  await requireRoleForPage('manager');
  const settings = await getShopSettingsRecord();
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Prices and deposit" lead="The labour rate, tax rate and deposit policy every new quote uses." back={{ href: '/catalogue', label: 'Catalogue' }} />
      {settings ? (
        <>
          <p className="text-sm tabular-nums text-ink-soft">
            Now: labour {formatCents(settings.laborRateCents)}/h · tax {percentFromBp(settings.taxRateBp)} · deposit {percentFromBp(settings.depositPercentBp)} of the total, at least {formatCents(settings.depositMinCents)} and at most {formatCents(settings.depositMaxCents)}.
          </p>
          <SettingsForm settings={settings} />
        </>
      ) : (
        <Banner tone="fault" title="The shop has no settings row">Run the migrations and the seed, then reload this page.</Banner>
      )}
    </div>
  );
}
