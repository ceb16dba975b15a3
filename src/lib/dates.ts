/**
 * Dates as a notebook writes them: ISO calendar dates (2026-03-14) in the reader's time zone,
 * with the full local date and time available for a title attribute.
 */

function parse(value: string | Date): Date | null {
  const d = value instanceof Date ? value : new Date(value);
  return Number.isNaN(d.getTime()) ? null : d;
}

const pad = (n: number) => String(n).padStart(2, '0');

/** "2026-03-14" (local calendar date); "—" for an unreadable value */
export function formatIsoDate(value: string | Date): string {
  const d = parse(value);
  if (!d) return '—';
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}

/** "2026-03-14 09:05" (local time) */
export function formatIsoDateTime(value: string | Date): string {
  const d = parse(value);
  if (!d) return '—';
  return `${formatIsoDate(d)} ${pad(d.getHours())}:${pad(d.getMinutes())}`;
}
