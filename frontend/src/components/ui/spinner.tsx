import { cn } from './cn';

export function Spinner({ size = 'md', className }: { size?: 'sm' | 'md' | 'lg'; className?: string }) {
  const dims = { sm: 'size-4 border-2', md: 'size-6 border-2', lg: 'size-9 border-[3px]' }[size];
  return (
    <span
      aria-hidden="true"
      className={cn('inline-block animate-spin rounded-full border-current border-r-transparent', dims, className)}
    />
  );
}

/** A labelled loading state for a region of the page. */
export function Loading({ label = 'Loading…', className }: { label?: string; className?: string }) {
  return (
    <div role="status" className={cn('flex items-center gap-3 py-6 text-ink-500', className)}>
      <Spinner />
      <span>{label}</span>
    </div>
  );
}
