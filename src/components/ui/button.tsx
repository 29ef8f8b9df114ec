import Link from 'next/link';

// One look for every action: `primary` is the one thing a screen is for, `quiet` anything beside it,
// `danger` a step that removes or refunds. White text sits only on ember-500 or darker (contrast rule).
export type ButtonVariant = 'primary' | 'quiet' | 'danger';

const base = 'rounded font-semibold disabled:opacity-60';
// `md` for the one submit button of a sign-in or account form, `sm` everywhere else.
const sizes = { sm: 'px-3 py-1.5 text-sm', md: 'px-4 py-2' };
export type ButtonSize = keyof typeof sizes;
const look: Record<ButtonVariant, string> = {
  primary: 'bg-ember-500 text-paper-raised hover:bg-ember-600',
  quiet: 'bg-paper-raised text-ink ring-1 ring-steel-300 hover:ring-gauge-500',
  danger: 'bg-paper-raised text-fault-700 ring-1 ring-fault-700/50 hover:bg-fault-100',
};

/** The class of a button in `variant`, for the few things that look like a button but are not one (a file label). */
export const buttonClass = (variant: ButtonVariant = 'quiet', extra = '', size: ButtonSize = 'sm') =>
  `${base} ${sizes[size]} ${look[variant]}${extra ? ` ${extra}` : ''}`;

type ButtonProps = React.ButtonHTMLAttributes<HTMLButtonElement> & { variant?: ButtonVariant; size?: ButtonSize };

export function Button({ variant = 'quiet', size = 'sm', className = '', ...props }: ButtonProps) {
  return <button {...props} className={buttonClass(variant, className, size)} />;
}

/** A link that looks like a button: for moving to another page, never for a change (those post to a route handler). */
export function ButtonLink({
  variant = 'quiet',
  className = '',
  ...props
}: React.ComponentProps<typeof Link> & { variant?: ButtonVariant }) {
  return <Link {...props} className={buttonClass(variant, className)} />;
}

/** A plain anchor styled as a button: downloads and files the browser fetches itself (PDF, CSV). */
export function ButtonAnchor({
  variant = 'quiet',
  className = '',
  ...props
}: React.AnchorHTMLAttributes<HTMLAnchorElement> & { variant?: ButtonVariant }) {
  return <a {...props} className={buttonClass(variant, className)} />;
}

/** A form's one submit button, saying "Working…" while the answer is awaited. */
export function SubmitButton({ busy, children }: { busy: boolean; children: React.ReactNode }) {
  return (
    <Button type="submit" variant="primary" size="md" disabled={busy}>
      {busy ? 'Working…' : children}
    </Button>
  );
}
