import { cn } from '@/components/ui/cn';

/** Packwright's mark: one pack, its warm half and its cool half. */
export function LogoMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" aria-hidden="true" className={cn('size-8 shrink-0', className)}>
      <rect width="32" height="32" rx="8" className="fill-ink-950" />
      <path d="M16 6a10 10 0 0 0 0 20z" className="fill-ember-400" />
      <path d="M16 6a10 10 0 0 1 0 20z" className="fill-frost-400" />
      <rect x="15" y="6" width="2" height="20" className="fill-ink-950" />
    </svg>
  );
}

export function Wordmark({ className, tone = 'light' }: { className?: string; tone?: 'light' | 'dark' }) {
  return (
    <span className={cn('inline-flex items-center gap-2.5', className)}>
      <LogoMark />
      <span className={cn('text-lead font-extrabold tracking-tight', tone === 'light' ? 'text-white' : 'text-ink-950')}>
        Packwright
      </span>
    </span>
  );
}
