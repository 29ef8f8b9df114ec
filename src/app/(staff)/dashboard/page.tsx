import type { Metadata } from 'next';
import Link from 'next/link';
import { Banner } from '@/components/ui/banner';
import { LinkCards } from '@/components/ui/link-cards';
import { requireAccessForPage } from '@/lib/auth/guard';
import { can } from '@/lib/auth/policy';
import { ROLE_NAMES, linksFor } from '@/lib/auth/staff-nav';
import { countStaleLeads } from '@/lib/db/queries/leads';
import { getShopSettings } from '@/lib/db/queries/settings';
import { staleCutoff } from '@/lib/leads/stale';

export const metadata: Metadata = { title: 'Staff home' };

export default async function DashboardPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requireAccessForPage('staff-area.open');
  const params = await searchParams;
  const denied = typeof params.denied === 'string' ? params.denied : null;
  const links = linksFor(user.role).filter((link) => link.href !== '/dashboard');
  // Leads that have gone cold, for the people who follow leads up.
  const limitDays = !can(user, 'leads.follow-up') ? null : ((await getShopSettings())?.leadStaleDays ?? 2);
  const staleLeads = limitDays === null ? 0 : await countStaleLeads(staleCutoff(new Date(), limitDays));
  return (
    <div className="flex flex-col gap-6">
      <header>
        <h1 className="text-2xl font-semibold">Hello, {user.name}</h1>
        <p className="text-sm text-ink-soft">
          Signed in as <span className="font-semibold">{ROLE_NAMES[user.role]}</span> ({user.email}).
        </p>
      </header>
      {denied ? (
        <Banner tone="caution">
          The page <span className="spec">{denied}</span> is not open to the {ROLE_NAMES[user.role].toLowerCase()} role.
          Ask a manager if you need it.
        </Banner>
      ) : null}
      {staleLeads > 0 ? (
        <Banner tone="caution">
          {staleLeads} new lead{staleLeads === 1 ? ' has' : 's have'} waited {limitDays} day{limitDays === 1 ? '' : 's'}{' '}
          or more without contact.{' '}
          <Link href="/leads?status=new" className="font-semibold underline">
            Follow them up on Leads
          </Link>
          .
        </Banner>
      ) : null}
      <nav aria-label="Your pages">
        <LinkCards links={links.map((link) => ({ href: link.href, label: link.label, text: link.description }))} />
      </nav>
    </div>
  );
}
