import { formatNumber } from '@/lib/format';

function countLabel(key: string): string {
  const words = key.replace(/[_-]+/g, ' ').replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** The role's counts from /api/home, as small figures. */
export function HomeCounts({ counts }: { counts: Record<string, number> }) {
  const entries = Object.entries(counts);
  if (entries.length === 0) return null;
  return (
    <dl className="grid grid-cols-2 gap-3">
      {entries.map(([key, value]) => (
        <div key={key} className="rounded-card border border-ink-100 bg-surface px-4 py-3 shadow-card">
          <dt className="text-caption font-semibold text-ink-500">{countLabel(key)}</dt>
          <dd className="mt-1 text-title font-extrabold text-ink-950 tabular-nums">{formatNumber(value, { maxFractionDigits: 0 })}</dd>
        </div>
      ))}
    </dl>
  );
}
