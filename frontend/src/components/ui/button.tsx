import type { ButtonHTMLAttributes, ReactNode } from 'react';
import { Link, type LinkProps } from 'react-router';
import { cn } from './cn';
import { Spinner } from './spinner';

type Variant = 'primary' | 'secondary' | 'ghost' | 'danger' | 'inverse';
type Size = 'sm' | 'md';

const base =
  'inline-flex items-center justify-center gap-2 rounded-control font-semibold transition-colors ' +
  'disabled:cursor-not-allowed disabled:opacity-60 focus-visible:outline-offset-2';

const variants: Record<Variant, string> = {
  primary: 'bg-ink-800 text-white hover:bg-ink-700 active:bg-ink-900',
  secondary: 'border border-ink-200 bg-surface text-ink-800 hover:border-ink-300 hover:bg-ink-50',
  ghost: 'text-ink-700 hover:bg-ink-100',
  danger: 'border border-rust-100 bg-rust-50 text-rust-700 hover:bg-rust-100',
  /** For dark surfaces such as the header. */
  inverse: 'border border-ink-600 text-ink-100 hover:border-ink-400 hover:bg-ink-800 hover:text-white',
};

const sizes: Record<Size, string> = {
  sm: 'h-8 px-3 text-small',
  md: 'h-10 px-4 text-body',
};

export function buttonClasses(variant: Variant = 'primary', size: Size = 'md', className?: string): string {
  return cn(base, variants[variant], sizes[size], className);
}

type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: Variant;
  size?: Size;
  /** Shows a spinner and disables the button while a request is in flight. */
  pending?: boolean;
  pendingLabel?: ReactNode;
};

export function Button({
  variant = 'primary',
  size = 'md',
  pending = false,
  pendingLabel,
  disabled,
  className,
  children,
  type = 'button',
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses(variant, size, className)}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      {...rest}
    >
      {pending && <Spinner size="sm" />}
      {pending && pendingLabel ? pendingLabel : children}
    </button>
  );
}

type ButtonLinkProps = LinkProps & { variant?: Variant; size?: Size };

export function ButtonLink({ variant = 'primary', size = 'md', className, ...rest }: ButtonLinkProps) {
  return <Link className={buttonClasses(variant, size, typeof className === 'string' ? className : undefined)} {...rest} />;
}
