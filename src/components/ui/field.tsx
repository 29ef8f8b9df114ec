// The one field set: text, number with its unit, select, checkbox and text area, each with its label above, a
// hint or the problem below, and aria-describedby pointing at both the unit and that message. Plain React (no
// formik, no zod) so the customer questionnaire can use it and stay light; formik forms bind it by name in
// formik-fields.tsx. `staff` is the counter's compact look, `large` the customer pages' big targets.

export type FieldLook = 'staff' | 'large';

type Common = {
  id: string;
  label: React.ReactNode;
  hint?: React.ReactNode;
  error?: string | null;
  look?: FieldLook;
  className?: string;
};

const LOOKS = {
  staff: {
    wrap: 'flex flex-col gap-1',
    label: 'text-sm font-semibold text-ink',
    control: (bad: boolean) =>
      `w-full min-w-0 rounded border bg-paper-raised px-3 py-2 text-ink ${bad ? 'border-fault-700' : 'border-steel-300'} focus:outline-2 focus:outline-gauge-500`,
    hint: 'text-xs text-ink-muted',
    error: 'text-xs text-fault-700',
  },
  large: {
    wrap: 'mt-5',
    label: 'block text-xl font-semibold',
    control: () =>
      'mt-2 block min-h-14 w-full rounded-lg border-2 border-steel-500 bg-paper-raised px-4 py-3 text-xl text-ink focus-visible:outline focus-visible:outline-4 focus-visible:outline-gauge-500 aria-[invalid=true]:border-fault-700',
    hint: 'mt-2 text-base text-ink-soft',
    error: 'mt-2 font-semibold text-fault-700',
  },
} as const;

const messageId = (id: string) => `${id}-msg`;
const unitId = (id: string) => `${id}-unit`;

/** What a control's aria-describedby names: its unit, then the problem or the hint. */
export function describedBy(
  id: string,
  { error, hint, unit }: { error?: string | null; hint?: React.ReactNode; unit?: string },
): string | undefined {
  return [unit ? unitId(id) : null, error || hint ? messageId(id) : null].filter(Boolean).join(' ') || undefined;
}

/** A control's invalid flag and description, the same on every kind of control. */
function stateOf(id: string, message: { error?: string | null; hint?: React.ReactNode; unit?: string }) {
  return { 'aria-invalid': message.error ? true : undefined, 'aria-describedby': describedBy(id, message) };
}

/** The problem (in words, starting "Problem:" on staff screens; read out at once on customer pages) or else the hint. */
function Message({
  id,
  error,
  hint,
  look,
}: {
  id: string;
  error?: string | null;
  hint?: React.ReactNode;
  look: FieldLook;
}) {
  if (error && look === 'large')
    return (
      <p id={messageId(id)} role="alert" className={LOOKS.large.error}>
        {error}
      </p>
    );
  if (error)
    return (
      <p id={messageId(id)} className={LOOKS.staff.error}>
        Problem: {error}
      </p>
    );
  if (hint)
    return (
      <p id={messageId(id)} className={LOOKS[look].hint}>
        {hint}
      </p>
    );
  return null;
}

function Shell({
  id,
  label,
  hint,
  error,
  look = 'staff',
  className = '',
  children,
}: Common & { children: React.ReactNode }) {
  return (
    <div className={`${LOOKS[look].wrap} ${className}`}>
      <label htmlFor={id} className={LOOKS[look].label}>
        {label}
      </label>
      {children}
      <Message id={id} error={error} hint={hint} look={look} />
    </div>
  );
}

type InputProps = Omit<React.InputHTMLAttributes<HTMLInputElement>, 'id' | 'className'>;

export function TextControl({ id, label, hint, error, look = 'staff', className, ...input }: Common & InputProps) {
  return (
    <Shell id={id} label={label} hint={hint} error={error} look={look} className={className}>
      <input
        id={id}
        type="text"
        {...input}
        {...stateOf(id, { error, hint })}
        className={LOOKS[look].control(Boolean(error))}
      />
    </Shell>
  );
}

/** A number typed as text with a decimal keypad, so a half-typed value ("0.") is never lost; its unit beside it. */
export function NumberControl({
  id,
  label,
  hint,
  error,
  unit,
  decimals = true,
  look = 'staff',
  className,
  ...input
}: Common & InputProps & { unit?: string; decimals?: boolean }) {
  return (
    <Shell id={id} label={label} hint={hint} error={error} look={look} className={className}>
      <div className="flex items-center gap-2">
        <input
          id={id}
          type="text"
          inputMode={decimals ? 'decimal' : 'numeric'}
          autoComplete="off"
          {...input}
          {...stateOf(id, { error, hint, unit })}
          className={`${LOOKS[look].control(Boolean(error))} spec`}
        />
        {unit ? (
          <span id={unitId(id)} className="shrink-0 text-sm text-ink-soft">
            {unit}
          </span>
        ) : null}
      </div>
    </Shell>
  );
}

export type Options = readonly (readonly [value: string, text: string])[];

export function SelectControl({
  id,
  label,
  hint,
  error,
  options,
  look = 'staff',
  className,
  ...select
}: Common & Omit<React.SelectHTMLAttributes<HTMLSelectElement>, 'id' | 'className'> & { options: Options }) {
  return (
    <Shell id={id} label={label} hint={hint} error={error} look={look} className={className}>
      <select id={id} {...select} {...stateOf(id, { error, hint })} className={LOOKS[look].control(Boolean(error))}>
        {options.map(([value, text]) => (
          <option key={value} value={value}>
            {text}
          </option>
        ))}
      </select>
    </Shell>
  );
}

export function TextAreaControl({
  id,
  label,
  hint,
  error,
  look = 'staff',
  className,
  ...area
}: Common & Omit<React.TextareaHTMLAttributes<HTMLTextAreaElement>, 'id' | 'className'>) {
  return (
    <Shell id={id} label={label} hint={hint} error={error} look={look} className={className}>
      <textarea
        id={id}
        rows={3}
        {...area}
        {...stateOf(id, { error, hint })}
        className={LOOKS[look].control(Boolean(error))}
      />
    </Shell>
  );
}

/** A yes/no box: the label holds the box and its words (the whole row is the target), the hint or problem below. */
export function CheckboxControl({
  id,
  label,
  hint,
  error,
  look = 'staff',
  className = '',
  ...input
}: Common & Omit<InputProps, 'type'>) {
  const large = look === 'large';
  return (
    <div className={className}>
      <label
        htmlFor={id}
        className={
          large
            ? 'mt-6 flex min-h-14 cursor-pointer items-start gap-4 rounded-lg border-2 border-steel-300 bg-paper-raised px-4 py-3'
            : 'flex items-start gap-2'
        }
      >
        <input
          id={id}
          type="checkbox"
          {...input}
          {...stateOf(id, { error, hint })}
          className={large ? 'mt-1 h-6 w-6 shrink-0 accent-ember-600' : 'mt-1 h-4 w-4'}
        />
        <span className={large ? 'text-xl' : 'text-sm font-semibold'}>{label}</span>
      </label>
      <Message id={id} error={error} hint={hint} look={look} />
    </div>
  );
}

/**
 * One choice of a few, as radio buttons under a legend (`legendHidden` when the form says it otherwise); each
 * option's words are its label, the problem sits below. `row` sets the choices side by side.
 */
export function RadioGroup<V extends string>({
  name,
  legend,
  legendHidden = false,
  options,
  value,
  onChange,
  error,
  row = false,
  className = '',
}: {
  name: string;
  legend: React.ReactNode;
  legendHidden?: boolean;
  options: readonly (readonly [value: V, text: React.ReactNode])[];
  value: V | '';
  onChange: (value: V) => void;
  error?: string | null;
  row?: boolean;
  className?: string;
}) {
  return (
    <fieldset className={`text-sm ${className}`}>
      <legend className={legendHidden ? 'sr-only' : 'font-semibold'}>{legend}</legend>
      <div className={row ? 'flex flex-wrap gap-x-4 gap-y-1' : 'mt-1 flex flex-col gap-1'}>
        {options.map(([option, text]) => (
          <label key={option} className="flex items-center gap-2">
            <input
              type="radio"
              name={name}
              value={option}
              checked={value === option}
              onChange={() => onChange(option)}
            />
            {text}
          </label>
        ))}
      </div>
      {error ? <p className={LOOKS.staff.error}>Problem: {error}</p> : null}
    </fieldset>
  );
}
