import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { Wordmark } from '@/components/brand/logo-mark';

/** The frame for signing in, resetting a password and accepting an invitation. */
export function AuthLayout({ title, description, children, footer }: { title: string; description?: ReactNode; children: ReactNode; footer?: ReactNode }) {
  return (
    <div className="grid min-h-dvh lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
      <title>{`${title} · Packwright`}</title>
      <aside className="relative hidden overflow-hidden bg-ink-900 p-12 text-ink-100 lg:flex lg:flex-col lg:justify-between">
        <Link to="/sign-in" className="self-start rounded-control">
          <Wordmark />
        </Link>
        <div className="relative z-10 max-w-md">
          <p className="text-display font-extrabold tracking-tight text-white">From a thermal target to a pack you can sign off.</p>
          <p className="mt-4 text-lead text-ink-300">
            Briefs, mixtures, hazard notes and reviews for cold packs and warm packs, in one workspace.
          </p>
        </div>
        <div className="relative z-10 flex gap-3 text-small font-semibold">
          <span className="rounded-full bg-frost-400/15 px-3 py-1 text-frost-200">Cold packs</span>
          <span className="rounded-full bg-ember-400/15 px-3 py-1 text-ember-200">Warm packs</span>
        </div>
        <div aria-hidden="true" className="pointer-events-none absolute -right-40 -bottom-40 size-[34rem] rounded-full bg-linear-to-br from-ember-500/25 via-transparent to-frost-400/25 blur-2xl" />
      </aside>

      <main className="flex flex-col items-center justify-center px-gutter py-section">
        <div className="w-full max-w-md">
          <Link to="/sign-in" className="mb-8 inline-block rounded-control lg:hidden">
            <Wordmark tone="dark" />
          </Link>
          <h1 className="text-headline font-extrabold tracking-tight text-ink-950">{title}</h1>
          {description && <div className="mt-2 text-body text-ink-600">{description}</div>}
          <div className="mt-8">{children}</div>
          {footer && <div className="mt-8 border-t border-ink-100 pt-6 text-small text-ink-600">{footer}</div>}
        </div>
      </main>
    </div>
  );
}
