import { useId, type InputHTMLAttributes, type ReactNode, type Ref, type SelectHTMLAttributes } from 'react';
import { cn } from './cn';

const controlClasses =
  'block w-full rounded-control border bg-surface px-3 text-body text-ink-900 placeholder:text-ink-400 ' +
  'transition-colors hover:border-ink-300 focus-visible:border-frost-500 disabled:bg-ink-50 disabled:text-ink-500';

function describedBy(...ids: Array<string | undefined>): string | undefined {
  const joined = ids.filter(Boolean).join(' ');
  return joined || undefined;
}

/**
 * Schema messages are fragments ("is required", "must be a valid e-mail address") meant to follow
 * the field's name; a message that is already a sentence is shown as it is.
 */
export function fieldErrorText(label: ReactNode, message: string): string {
  if (typeof label === 'string' && /^[a-z]/.test(message)) return `${label} ${message}.`.replace(/\.\.$/, '.');
  return message;
}

type FieldChromeProps = {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  className?: string;
  children: ReactNode;
  /** Visually hide the label (it is still read by screen readers). */
  hideLabel?: boolean;
};

function FieldChrome({ id, label, hint, error, className, children, hideLabel }: FieldChromeProps) {
  return (
    <div className={cn('flex flex-col gap-1.5', className)}>
      <label htmlFor={id} className={cn('text-small font-semibold text-ink-800', hideLabel && 'sr-only')}>
        {label}
      </label>
      {children}
      {hint && !error && (
        <p id={`${id}-hint`} className="text-caption text-ink-500">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-caption font-semibold text-rust-600">
          {fieldErrorText(label, error)}
        </p>
      )}
    </div>
  );
}

type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> & {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  ref?: Ref<HTMLInputElement>;
  containerClassName?: string;
  hideLabel?: boolean;
};

export function TextField({ label, hint, error, containerClassName, className, hideLabel, ref, ...input }: TextFieldProps) {
  const id = useId();
  return (
    <FieldChrome id={id} label={label} hint={hint} error={error} className={containerClassName} hideLabel={hideLabel}>
      <input
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(hint && !error ? `${id}-hint` : undefined, error ? `${id}-error` : undefined)}
        className={cn(controlClasses, 'h-10', error ? 'border-rust-500' : 'border-ink-200', className)}
        {...input}
      />
    </FieldChrome>
  );
}

type SelectFieldProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> & {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  ref?: Ref<HTMLSelectElement>;
  containerClassName?: string;
  hideLabel?: boolean;
  controlSize?: 'sm' | 'md';
};

export function SelectField({
  label,
  hint,
  error,
  containerClassName,
  className,
  hideLabel,
  ref,
  controlSize = 'md',
  children,
  ...select
}: SelectFieldProps) {
  const id = useId();
  return (
    <FieldChrome id={id} label={label} hint={hint} error={error} className={containerClassName} hideLabel={hideLabel}>
      <select
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(hint && !error ? `${id}-hint` : undefined, error ? `${id}-error` : undefined)}
        className={cn(
          controlClasses,
          controlSize === 'sm' ? 'h-8 text-small' : 'h-10',
          'pr-8',
          error ? 'border-rust-500' : 'border-ink-200',
          className,
        )}
        {...select}
      >
        {children}
      </select>
    </FieldChrome>
  );
}

/** A form-level message region, announced when it changes. */
export function FormMessage({ children, tone = 'danger' }: { children?: ReactNode; tone?: 'danger' | 'success' }) {
  if (!children) return null;
  return (
    <p
      role={tone === 'danger' ? 'alert' : 'status'}
      className={cn(
        'rounded-control border px-3 py-2 text-small',
        tone === 'danger' ? 'border-rust-100 bg-rust-50 text-rust-700' : 'border-moss-100 bg-moss-50 text-moss-700',
      )}
    >
      {children}
    </p>
  );
}
