import { Link } from 'react-router';
import type { NavItem } from '@/config/nav';

export function QuickLinks({ items }: { items: NavItem[] }) {
  if (items.length === 0) return null;
  return (
    <ul className="grid gap-3 sm:grid-cols-2">
      {items.map((item) => (
        <li key={item.to}>
          <Link
            to={item.to}
            className="group flex h-full flex-col rounded-card border border-ink-100 bg-surface px-4 py-3 shadow-card transition-colors hover:border-frost-300"
          >
            <span className="font-bold text-ink-900 group-hover:text-frost-700">
              {item.label} <span aria-hidden="true">→</span>
            </span>
            <span className="text-small text-ink-600">{item.description}</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
