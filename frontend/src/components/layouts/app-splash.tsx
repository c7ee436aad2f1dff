import { LogoMark } from '@/components/brand/logo-mark';
import { Spinner } from '@/components/ui/spinner';

/** Shown while the first route's code and session check load. */
export function AppSplash() {
  return (
    <div role="status" className="flex min-h-dvh flex-col items-center justify-center gap-4 text-ink-500">
      <LogoMark className="size-12" />
      <span className="flex items-center gap-2 text-small">
        <Spinner size="sm" /> Loading Packwright…
      </span>
    </div>
  );
}
