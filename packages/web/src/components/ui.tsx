import type { ButtonHTMLAttributes, ReactNode } from 'react';

type Tone = 'primary' | 'plain' | 'danger';
const TONES: Record<Tone, string> = {
  primary: 'bg-glow text-white hover:bg-[#8f3b14] disabled:bg-dim/40',
  plain: 'border border-rule bg-sheet text-ink hover:bg-petrol-soft disabled:text-dim/60',
  danger: 'border border-brick/50 bg-sheet text-brick hover:bg-brick-soft disabled:text-dim/60',
};

/** The app's button; disabled buttons look disabled and say why through `title`. */
export function Button({
  tone = 'plain',
  className = '',
  ...rest
}: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: Tone }) {
  return (
    <button
      type="button"
      className={`inline-flex items-center justify-center gap-1.5 rounded-md px-3 py-1.5 text-sm font-medium transition-colors disabled:cursor-not-allowed ${TONES[tone]} ${className}`}
      {...rest}
    />
  );
}

/** A titled white sheet on the paper background. */
export function Panel({
  title,
  actions,
  children,
  className = '',
}: {
  title?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
}) {
  return (
    <section className={`print-break rounded-lg border border-rule bg-sheet p-4 ${className}`}>
      {(title || actions) && (
        <header className="mb-3 flex items-center justify-between gap-2">
          {title && <h2 className="text-sm font-semibold tracking-wide text-petrol uppercase">{title}</h2>}
          {actions && <div className="flex gap-2">{actions}</div>}
        </header>
      )}
      {children}
    </section>
  );
}

export const inputClass =
  'w-full rounded-md border border-rule bg-white px-2.5 py-1.5 text-sm text-ink placeholder:text-dim/70 focus:border-glow focus:outline-none disabled:bg-paper disabled:text-dim';
export const labelClass = 'block text-xs font-medium text-dim mb-1';

export function PageTitle({ children, sub }: { children: ReactNode; sub?: ReactNode }) {
  return (
    <div className="mb-5">
      <h1 className="text-2xl font-semibold tracking-tight text-ink">{children}</h1>
      {sub && <p className="mt-1 text-sm text-dim">{sub}</p>}
    </div>
  );
}
