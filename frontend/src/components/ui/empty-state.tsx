import type { ReactNode } from 'react';
import { cn } from './cn';

export function EmptyState({
  title,
  children,
  action,
  className,
}: {
  title: ReactNode;
  children?: ReactNode;
  action?: ReactNode;
  className?: string;
}) {
  return (
    <div className={cn('rounded-card border border-dashed border-ink-200 bg-ink-50/60 px-6 py-8 text-center', className)}>
      <p className="font-semibold text-ink-800">{title}</p>
      {children && <div className="mx-auto mt-1 max-w-md text-small text-ink-500">{children}</div>}
      {action && <div className="mt-4 flex justify-center">{action}</div>}
    </div>
  );
}
