import type { ReactNode } from 'react';
import { Link, NavLink, useNavigation } from 'react-router';
import { ROLE_LABELS, type Role } from '@shared/schemas/common';
import { Wordmark } from '@/components/brand/logo-mark';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import type { NavItem } from '@/config/nav';

type AppLayoutProps = {
  workspaceName: string;
  personName: string;
  personEmail: string;
  role: Role;
  nav: NavItem[];
  onSignOut: () => void;
  signingOut: boolean;
  children: ReactNode;
};

export function AppLayout({ workspaceName, personName, personEmail, role, nav, onSignOut, signingOut, children }: AppLayoutProps) {
  const navigation = useNavigation();
  const busy = navigation.state !== 'idle';

  return (
    <div className="flex min-h-dvh flex-col">
      <a
        href="#main"
        className="sr-only z-50 rounded-control bg-white px-3 py-2 font-semibold text-ink-900 focus:not-sr-only focus:fixed focus:top-2 focus:left-2"
      >
        Skip to content
      </a>

      <header className="relative bg-ink-900 text-ink-100">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-3 px-gutter py-3">
          <div className="flex min-w-0 flex-wrap items-center gap-x-4 gap-y-1">
            <Link to="/" className="rounded-control" aria-label="Packwright home">
              <Wordmark />
            </Link>
            <span aria-hidden="true" className="hidden h-6 w-px bg-ink-700 sm:block" />
            <p className="min-w-0 truncate text-small font-semibold text-ink-200" title="Workspace">
              <span className="sr-only">Workspace: </span>
              {workspaceName}
            </p>
          </div>

          <div className="ml-auto flex items-center gap-3">
            <div className="text-right leading-tight">
              <p className="text-small font-bold text-white" title={personEmail}>
                {personName}
              </p>
              <p className="text-caption text-ink-300">{ROLE_LABELS[role]}</p>
            </div>
            <Button
              variant="inverse"
              size="sm"
              onClick={onSignOut}
              pending={signingOut}
            >
              Sign out
            </Button>
          </div>
        </div>

        <nav aria-label="Main" className="border-t border-ink-800">
          <ul className="mx-auto flex max-w-7xl flex-wrap gap-1 px-gutter">
            {nav.map((item) => (
              <li key={item.to}>
                <NavLink
                  to={item.to}
                  end={item.end}
                  className={({ isActive }) =>
                    cn(
                      'relative inline-flex h-11 items-center px-3 text-small font-semibold transition-colors',
                      isActive
                        ? 'text-white after:absolute after:inset-x-3 after:bottom-0 after:h-[3px] after:rounded-t after:bg-linear-to-r after:from-ember-400 after:to-frost-400'
                        : 'text-ink-300 hover:text-white',
                    )
                  }
                >
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>

        <div
          aria-hidden="true"
          className={cn(
            'absolute inset-x-0 bottom-0 h-0.5 origin-left bg-frost-300 transition-transform duration-500',
            busy ? 'scale-x-75' : 'scale-x-0',
          )}
        />
      </header>

      <main id="main" tabIndex={-1} className="mx-auto w-full max-w-7xl flex-1 px-gutter py-section focus:outline-none">
        {children}
      </main>

      <footer className="border-t border-ink-100 py-4 text-center text-caption text-ink-500">
        Packwright · {workspaceName}
      </footer>
    </div>
  );
}
