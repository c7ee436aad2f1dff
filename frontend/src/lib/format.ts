/**
 * The one formatter for dates, times and numbers shown in Packwright. Components never call
 * `toLocaleString` or `Intl` themselves, so every screen reads the same way.
 */

const LOCALE = undefined; // the reader's own locale

const dateFormat = new Intl.DateTimeFormat(LOCALE, { year: 'numeric', month: 'short', day: 'numeric' });
const dateTimeFormat = new Intl.DateTimeFormat(LOCALE, {
  year: 'numeric',
  month: 'short',
  day: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
});
const timeFormat = new Intl.DateTimeFormat(LOCALE, { hour: '2-digit', minute: '2-digit' });
const relativeFormat = new Intl.RelativeTimeFormat(LOCALE, { numeric: 'auto' });

function toDate(value: string | number | Date): Date | null {
  const date = value instanceof Date ? value : new Date(value);
  return Number.isNaN(date.getTime()) ? null : date;
}

/** "12 Mar 2025" */
export function formatDate(value: string | number | Date | null | undefined, empty = '—'): string {
  if (value === null || value === undefined) return empty;
  const date = toDate(value);
  return date ? dateFormat.format(date) : empty;
}

/** "12 Mar 2025, 14:05" */
export function formatDateTime(value: string | number | Date | null | undefined, empty = '—'): string {
  if (value === null || value === undefined) return empty;
  const date = toDate(value);
  return date ? dateTimeFormat.format(date) : empty;
}

/** The time today, else the date and time: for lists where recent items matter most. */
export function formatWhen(value: string | number | Date | null | undefined, now: Date = new Date(), empty = '—'): string {
  if (value === null || value === undefined) return empty;
  const date = toDate(value);
  if (!date) return empty;
  const sameDay = date.toDateString() === now.toDateString();
  return sameDay ? `Today, ${timeFormat.format(date)}` : dateTimeFormat.format(date);
}

const RELATIVE_STEPS: Array<[Intl.RelativeTimeFormatUnit, number]> = [
  ['second', 60],
  ['minute', 60],
  ['hour', 24],
  ['day', 7],
  ['week', 4.35],
  ['month', 12],
  ['year', Number.POSITIVE_INFINITY],
];

/** "3 minutes ago", "in 2 days" */
export function formatRelative(value: string | number | Date | null | undefined, now: Date = new Date(), empty = '—'): string {
  if (value === null || value === undefined) return empty;
  const date = toDate(value);
  if (!date) return empty;
  let amount = (date.getTime() - now.getTime()) / 1000;
  if (Math.abs(amount) < 45) return 'just now';
  for (const [unit, size] of RELATIVE_STEPS) {
    if (Math.abs(amount) < size) return relativeFormat.format(Math.round(amount), unit);
    amount /= size;
  }
  return dateFormat.format(date);
}

const numberFormats = new Map<string, Intl.NumberFormat>();
function numberFormat(options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = JSON.stringify(options);
  let format = numberFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat(LOCALE, options);
    numberFormats.set(key, format);
  }
  return format;
}

/** A plain number with at most `maxFractionDigits` decimals (default 1). */
export function formatNumber(
  value: number | null | undefined,
  options: { maxFractionDigits?: number; minFractionDigits?: number; empty?: string } = {},
): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return options.empty ?? '—';
  const maximumFractionDigits = options.maxFractionDigits ?? 1;
  return numberFormat({
    maximumFractionDigits,
    minimumFractionDigits: Math.min(options.minFractionDigits ?? 0, maximumFractionDigits),
  }).format(value);
}

/** A number followed by its unit, with a thin no-break space: "42.5 °C", "180 g". */
export function formatQuantity(value: number | null | undefined, unit: string, maxFractionDigits = 1): string {
  const number = formatNumber(value, { maxFractionDigits });
  return number === '—' ? number : `${number}\u202f${unit}`;
}

/**
 * Money given as a decimal string or number in the currency's major unit ("1.25" EUR → "€1.25").
 * Decimal strings are formatted without a round trip through arithmetic.
 */
export function formatMoney(value: string | number | null | undefined, currency: string, empty = '—'): string {
  if (value === null || value === undefined || value === '') return empty;
  const amount = typeof value === 'string' ? Number(value) : value;
  if (!Number.isFinite(amount)) return empty;
  return numberFormat({ style: 'currency', currency, minimumFractionDigits: 2, maximumFractionDigits: 4 }).format(amount);
}

/** "1 invitation", "3 invitations" */
export function formatCount(count: number, singular: string, plural = `${singular}s`): string {
  return `${formatNumber(count, { maxFractionDigits: 0 })} ${count === 1 ? singular : plural}`;
}

/** How long something took, from two instants: "0.8 s", "42 s", "3 min 5 s"; "—" while unfinished. */
export function formatDuration(start: string | number | Date | null | undefined, end: string | number | Date | null | undefined, empty = '—'): string {
  if (start === null || start === undefined || end === null || end === undefined) return empty;
  const a = toDate(start);
  const b = toDate(end);
  if (!a || !b) return empty;
  const seconds = Math.max(0, (b.getTime() - a.getTime()) / 1000);
  if (seconds < 10) return `${formatNumber(seconds, { maxFractionDigits: 1 })}\u202fs`;
  if (seconds < 60) return `${formatNumber(seconds, { maxFractionDigits: 0 })}\u202fs`;
  const minutes = Math.floor(seconds / 60);
  return `${formatNumber(minutes, { maxFractionDigits: 0 })}\u202fmin ${formatNumber(Math.round(seconds - minutes * 60), { maxFractionDigits: 0 })}\u202fs`;
}
