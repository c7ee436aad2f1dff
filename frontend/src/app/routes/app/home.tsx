import type { QueryClient } from '@tanstack/react-query';
import { ROLE_LABELS, type Role } from '@shared/schemas/common';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { cn } from '@/components/ui/cn';
import { PageHeader } from '@/components/ui/page-header';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { quickLinksForRole } from '@/config/nav';
import { getHomeQueryOptions, useHome } from '@/features/home/api/get-home';
import { HomeCounts } from '@/features/home/components/home-counts';
import { QuickLinks } from '@/features/home/components/quick-links';
import { WaitingList } from '@/features/home/components/waiting-list';
import { useSessionUser } from '@/lib/session';

export const clientLoader = (queryClient: QueryClient) => () => {
  // Start loading while the page's code arrives; the page shows its own loading state.
  void queryClient.prefetchQuery(getHomeQueryOptions());
  return null;
};

const ROLE_INTRO: Record<Role, string> = {
  designer: 'Write briefs, compare candidates and send the best one for review.',
  chemist: 'Keep the ingredient library and species data sound, and vet the chemistry of submitted candidates.',
  reviewer: 'Check hazard notes, label elements and contact-temperature limits, then sign off or send back.',
  admin: 'Invite people, set their roles and look after the workspace.',
};

function greeting(now: Date): string {
  const hour = now.getHours();
  if (hour < 12) return 'Good morning';
  if (hour < 18) return 'Good afternoon';
  return 'Good evening';
}

export default function HomeRoute() {
  const user = useSessionUser();
  const home = useHome();
  const quickLinks = quickLinksForRole(user.role);
  const firstName = user.name.split(/\s+/)[0] || user.name;
  const hasCounts = home.isSuccess && Object.keys(home.data.counts).length > 0;
  const hasAside = hasCounts || quickLinks.length > 0;

  return (
    <>
      <title>Home · Packwright</title>
      <PageHeader
        title={`${greeting(new Date())}, ${firstName}`}
        description={
          <>
            <span className="font-semibold text-ink-800">{ROLE_LABELS[user.role]}</span> in {user.workspace.name}.{' '}
            {ROLE_INTRO[user.role]}
          </>
        }
      />

      <div
        className={cn(
          'grid grid-cols-1 items-start gap-gutter',
          hasAside ? 'lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]' : 'max-w-3xl',
        )}
      >
        <Card>
          <CardHeader id="waiting-heading" title="Waiting for you" description="Things that need your attention." />
          <CardBody>
            {home.isPending ? (
              <Loading label="Loading what is waiting…" />
            ) : home.isError ? (
              <QueryError error={home.error} onRetry={() => void home.refetch()} retrying={home.isFetching} />
            ) : (
              <WaitingList items={home.data.waiting} />
            )}
          </CardBody>
        </Card>

        {hasAside && (
          <div className="flex flex-col gap-gutter">
            {hasCounts && (
              <section aria-labelledby="counts-heading">
                <h2 id="counts-heading" className="mb-3 text-lead font-bold text-ink-900">
                  At a glance
                </h2>
                <HomeCounts counts={home.data.counts} />
              </section>
            )}
            {quickLinks.length > 0 && (
              <section aria-labelledby="quick-links-heading">
                <h2 id="quick-links-heading" className="mb-3 text-lead font-bold text-ink-900">
                  Go to
                </h2>
                <QuickLinks items={quickLinks} />
              </section>
            )}
          </div>
        )}
      </div>
    </>
  );
}
