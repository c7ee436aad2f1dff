import { Link } from 'react-router';
import type { HomeResponse } from '@shared/schemas/health';
import { Badge } from '@/components/ui/badge';
import { EmptyState } from '@/components/ui/empty-state';

type WaitingItem = HomeResponse['waiting'][number];

function kindLabel(kind: string): string {
  const words = kind.replace(/[_-]+/g, ' ').replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** Internal links stay in the app; anything else opens as a plain link. */
function ItemLink({ item }: { item: WaitingItem }) {
  const className = 'font-bold text-ink-900 hover:text-frost-700 hover:underline';
  return item.href.startsWith('/') ? (
    <Link to={item.href} className={className}>
      {item.title}
    </Link>
  ) : (
    <a href={item.href} className={className}>
      {item.title}
    </a>
  );
}

export function WaitingList({ items }: { items: WaitingItem[] }) {
  if (items.length === 0) {
    return (
      <EmptyState title="Nothing is waiting for you">
        When a brief, candidate or review needs you, it shows up here.
      </EmptyState>
    );
  }
  return (
    <ul className="divide-y divide-ink-100">
      {items.map((item, index) => (
        <li key={`${item.kind}-${item.href}-${index}`} className="flex flex-wrap items-start gap-x-4 gap-y-1 py-3 first:pt-0 last:pb-0">
          <Badge tone="cool" className="mt-0.5">
            {kindLabel(item.kind)}
          </Badge>
          <div className="min-w-0 flex-1">
            <ItemLink item={item} />
            {item.detail && <p className="text-small text-ink-600">{item.detail}</p>}
          </div>
        </li>
      ))}
    </ul>
  );
}
