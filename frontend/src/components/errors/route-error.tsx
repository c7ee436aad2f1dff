import type { ReactNode } from 'react';
import { isRouteErrorResponse, useRouteError } from 'react-router';
import type { Role } from '@shared/schemas/common';
import { ROLES } from '@shared/schemas/roles';
import { Wordmark } from '@/components/brand/logo-mark';
import { Button, ButtonLink } from '@/components/ui/button';
import { errorMessage, isApiError } from '@/lib/api-client';
import { ForbiddenMessage } from './forbidden-message';
import { NotFoundMessage } from './not-found-message';
import { StatusPage } from './status-page';

function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}

function forbiddenDetails(data: unknown): { roles?: Role[]; role?: Role } {
  if (!data || typeof data !== 'object') return {};
  const record = data as { roles?: unknown; role?: unknown };
  return {
    roles: Array.isArray(record.roles) ? record.roles.filter(isRole) : undefined,
    role: isRole(record.role) ? record.role : undefined,
  };
}

/** A lazily loaded chunk that is gone usually means a new version was deployed. */
function isChunkLoadError(error: unknown): boolean {
  return error instanceof Error && /dynamically imported module|Importing a module script failed|Failed to fetch/i.test(error.message);
}

/** The route errorElement: friendly words for 404, 403 and anything unexpected. */
export function RouteError({ bare = false }: { bare?: boolean }) {
  const error = useRouteError();
  const Frame = bare ? BareFrame : InlineFrame;

  if (isRouteErrorResponse(error)) {
    if (error.status === 404) return <Frame><NotFoundMessage /></Frame>;
    if (error.status === 403) return <Frame><ForbiddenMessage {...forbiddenDetails(error.data)} /></Frame>;
  }
  if (isApiError(error)) {
    if (error.status === 404) return <Frame><NotFoundMessage /></Frame>;
    if (error.status === 403) return <Frame><ForbiddenMessage /></Frame>;
  }

  const detail = isChunkLoadError(error)
    ? 'Packwright was updated while this tab was open. Reload to get the new version.'
    : isRouteErrorResponse(error)
      ? `${error.status} ${error.statusText}`
      : errorMessage(error);

  return (
    <Frame>
      <StatusPage
        eyebrow="Something went wrong"
        title="This page ran into a problem"
        actions={
          <>
            <Button onClick={() => window.location.reload()}>Reload the page</Button>
            <ButtonLink to="/" variant="secondary">
              Go to your home page
            </ButtonLink>
          </>
        }
      >
        <p>Reload to try again. If it keeps happening, tell your administrator what you were doing when it appeared.</p>
        <p className="mt-3 rounded-control bg-ink-100/60 px-3 py-2 text-small text-ink-700">{detail}</p>
      </StatusPage>
    </Frame>
  );
}

/** Inside the app layout: the header and navigation are already there. */
function InlineFrame({ children }: { children: ReactNode }) {
  return <div className="px-gutter">{children}</div>;
}

/** Outside any layout (the session check itself failed): a page of its own. */
function BareFrame({ children }: { children: ReactNode }) {
  return (
    <div className="min-h-dvh">
      <header className="bg-ink-900 px-gutter py-3">
        <Wordmark />
      </header>
      <main className="px-gutter py-section">{children}</main>
    </div>
  );
}
