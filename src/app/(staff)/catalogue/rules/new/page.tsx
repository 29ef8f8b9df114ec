import type { Metadata } from 'next';
import { RuleForm } from '@/components/catalogue/rule-form';
import { PageHeader } from '@/components/ui/page-header';
import { requireAccessForPage } from '@/lib/auth/guard';
import { allLabor } from '@/lib/db/queries/labor';
import { allParts } from '@/lib/db/queries/parts';

export const metadata: Metadata = { title: 'Add a rule' };

export default async function NewRulePage() {
  await requireAccessForPage('catalogue.write');
  const [parts, labor] = await Promise.all([allParts(), allLabor()]);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Add a rule"
        lead="Pick when it applies, then what it adds."
        back={{ href: '/catalogue/rules', label: 'What a cam needs' }}
      />
      <RuleForm rule={null} parts={parts} labor={labor} />
    </div>
  );
}
