import type { ButtonHTMLAttributes, ReactNode } from 'react';
import { Link, type LinkProps } from 'react-router-dom';
import { cx } from './cx';
import { SpinnerIcon } from './spinner';

type Variant = 'primary' | 'secondary' | 'ghost' | 'danger';
type Size = 'md' | 'sm';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-brand-700 text-white hover:bg-brand-800 disabled:bg-brand-700/60',
  secondary: 'border border-line-strong bg-canvas-raised text-ink hover:bg-canvas-sunken',
  ghost: 'text-brand-800 hover:bg-brand-50',
  danger: 'bg-danger-700 text-white hover:bg-danger-800',
};
const SIZES: Record<Size, string> = { md: 'px-4 py-2.5 text-base', sm: 'px-3 py-1.5 text-sm' };

export function buttonClasses(variant: Variant = 'primary', size: Size = 'md', extra?: string): string {
  return cx(
    'inline-flex items-center justify-center gap-2 rounded-lg font-medium transition-colors disabled:cursor-not-allowed',
    VARIANTS[variant],
    SIZES[size],
    extra,
  );
}

type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: Variant;
  size?: Size;
  /** While true the button is disabled, says so to assistive tech, and shows `busyLabel`. */
  busy?: boolean;
  busyLabel?: ReactNode;
};

export function Button({ variant, size, busy = false, busyLabel, className, disabled, children, type = 'button', ...rest }: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses(variant, size, className)}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...rest}
    >
      {busy ? (
        <>
          <SpinnerIcon className="size-4" />
          {busyLabel ?? children}
        </>
      ) : (
        children
      )}
    </button>
  );
}

/** A router link that looks like a button (calls to action that navigate). */
export function ButtonLink({ variant, size, className, ...rest }: LinkProps & { variant?: Variant; size?: Size }) {
  return <Link className={buttonClasses(variant, size, className)} {...rest} />;
}
