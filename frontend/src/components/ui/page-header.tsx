import type { ReactNode } from 'react';

export function PageHeader({ title, description, action }: { title: ReactNode; description?: ReactNode; action?: ReactNode }) {
  return (
    <div className="mb-gutter flex flex-wrap items-end justify-between gap-4">
      <div>
        <h1 className="text-headline font-extrabold tracking-tight text-ink-950">{title}</h1>
        {description && <p className="mt-1 max-w-2xl text-body text-ink-600">{description}</p>}
      </div>
      {action}
    </div>
  );
}
