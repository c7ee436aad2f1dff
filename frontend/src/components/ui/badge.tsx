import type { ReactNode } from 'react';
import { cn } from './cn';

type Tone = 'neutral' | 'warm' | 'cool' | 'success' | 'caution' | 'danger';

const tones: Record<Tone, string> = {
  neutral: 'bg-ink-100 text-ink-700',
  warm: 'bg-ember-100 text-ember-700',
  cool: 'bg-frost-100 text-frost-700',
  success: 'bg-moss-100 text-moss-700',
  caution: 'bg-amber-100 text-amber-700',
  danger: 'bg-rust-100 text-rust-700',
};

export function Badge({ tone = 'neutral', children, className }: { tone?: Tone; children: ReactNode; className?: string }) {
  return (
    <span className={cn('inline-flex items-center rounded-full px-2 py-0.5 text-caption font-semibold', tones[tone], className)}>
      {children}
    </span>
  );
}
