import type { ReactNode } from 'react';
import { cn } from './cn';

type Tone = 'info' | 'success' | 'caution' | 'danger';

const tones: Record<Tone, string> = {
  info: 'border-frost-200 bg-frost-50 text-frost-700',
  success: 'border-moss-100 bg-moss-50 text-moss-700',
  caution: 'border-amber-100 bg-amber-50 text-amber-700',
  danger: 'border-rust-100 bg-rust-50 text-rust-700',
};

export function Alert({
  tone = 'info',
  title,
  children,
  action,
  className,
}: {
  tone?: Tone;
  title?: ReactNode;
  children?: ReactNode;
  action?: ReactNode;
  className?: string;
}) {
  return (
    <div
      role={tone === 'danger' ? 'alert' : 'status'}
      className={cn('flex flex-wrap items-start justify-between gap-3 rounded-control border px-4 py-3 text-small', tones[tone], className)}
    >
      <div className="min-w-0 flex-1">
        {title && <p className="font-semibold">{title}</p>}
        {children && <div className={cn(title ? 'mt-0.5' : undefined)}>{children}</div>}
      </div>
      {action && <div className="shrink-0">{action}</div>}
    </div>
  );
}
