import type { Metadata } from 'next';
import { formatMoney, percentFromBp } from '@/lib/format';
import { SettingsForm } from '@/components/catalogue/part-labor-settings-forms';
import { Banner } from '@/components/ui/banner';
import { PageHeader } from '@/components/ui/page-header';
import { requireAccessForPage } from '@/lib/auth/guard';
import { getShopSettingsRecord } from '@/lib/db/queries/settings';
import { AIR_UNITS_WORDS } from '@/lib/dyno/units';

export const metadata: Metadata = { title: 'Prices and deposit' };

export default async function SettingsPage() {
  await requireAccessForPage('settings.manage');
  const settings = await getShopSettingsRecord();
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Prices and deposit"
        lead="The labour rate, tax rate and deposit policy every new quote uses."
        back={{ href: '/catalogue', label: 'Catalogue' }}
      />
      {settings ? (
        <>
          <p className="text-sm tabular-nums text-ink-soft">
            Now: labour {formatMoney(settings.laborRateCents, { currency: settings.currency })}/h · tax{' '}
            {percentFromBp(settings.taxRateBp)} · deposit {percentFromBp(settings.depositPercentBp)} of the total, at
            least {formatMoney(settings.depositMinCents, { currency: settings.currency })} and at most{' '}
            {formatMoney(settings.depositMaxCents, { currency: settings.currency })}. Dyno air in{' '}
            {AIR_UNITS_WORDS[settings.dynoAirUnits]}.
          </p>
          <SettingsForm settings={settings} />
        </>
      ) : (
        <Banner tone="fault" title="The shop has no settings row">
          Run the migrations and the seed, then reload this page.
        </Banner>
      )}
    </div>
  );
}
