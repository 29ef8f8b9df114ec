// The interview's numbered sections; the fields inside come from the shared set (components/ui/formik-fields).
export function Section({
  title,
  lead,
  children,
  step,
}: {
  title: string;
  lead?: string;
  children: React.ReactNode;
  step: number;
}) {
  return (
    <fieldset className="rounded-lg border border-steel-300 bg-paper-raised p-4">
      <legend className="px-1 text-base font-semibold">
        <span className="spec mr-2 text-ink-muted">{step}.</span>
        {title}
      </legend>
      {lead ? <p className="mb-3 text-sm text-ink-soft">{lead}</p> : null}
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-4">{children}</div>
    </fieldset>
  );
}
