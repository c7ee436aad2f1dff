import type { ReactNode } from 'react';

/** A friendly full-width message: not found, not for your role, something broke. */
export function StatusPage({
  eyebrow,
  title,
  children,
  actions,
}: {
  eyebrow: string;
  title: string;
  children?: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <div className="mx-auto max-w-xl py-section text-center">
      <title>{`${title} · Packwright`}</title>
      <p className="text-small font-bold tracking-widest text-frost-600 uppercase">{eyebrow}</p>
      <h1 className="mt-2 text-headline font-extrabold text-ink-950">{title}</h1>
      {children && <div className="mt-3 text-body text-ink-600">{children}</div>}
      {actions && <div className="mt-6 flex flex-wrap justify-center gap-3">{actions}</div>}
    </div>
  );
}
