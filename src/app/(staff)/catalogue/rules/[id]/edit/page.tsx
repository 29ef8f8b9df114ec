import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { DeleteButton, RuleForm } from '@/components/catalogue/rule-form';
import { PageHeader } from '@/components/ui/page-header';
import { requireAccessForPage } from '@/lib/auth/guard';
import { allLabor } from '@/lib/db/queries/labor';
import { allParts } from '@/lib/db/queries/parts';
import { getRule } from '@/lib/db/queries/rules';

export const metadata: Metadata = { title: 'Edit rule' };

export default async function EditRulePage({ params }: { params: Promise<{ id: string }> }) {
  await requireAccessForPage('catalogue.write');
  const { id } = await params;
  const rule = /^\d{1,10}$/.test(id) ? await getRule(Number(id)) : null;
  if (!rule) notFound();
  const [parts, labor] = await Promise.all([allParts(), allLabor()]);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Edit rule"
        lead={rule.label}
        back={{ href: '/catalogue/rules', label: 'What a cam needs' }}
        actions={<DeleteButton url={`/api/rules/${rule.id}`} label="Delete rule" after="/catalogue/rules" />}
      />
      <RuleForm rule={rule} parts={parts} labor={labor} />
    </div>
  );
}
