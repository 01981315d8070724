/**
 * Dates as every page shows them: "6 Apr 2026", and "6 Apr 2026, 14:05" where the time matters. The one place
 * that formats a date, so no page writes "06/04/2026" beside another's "6 Apr 2026". E-mails spell the month out
 * in their sentences (`long`).
 */
type DateInput = string | number | Date;

const toDate = (v: DateInput) => (v instanceof Date ? v : new Date(v));

// in UTC, so the page the server drew and the one the browser hydrates read the same day
export function formatDate(
  value: DateInput,
  { long = false, timeZone = 'UTC' }: { long?: boolean; timeZone?: string } = {},
): string {
  return toDate(value).toLocaleDateString('en-GB', { day: 'numeric', month: long ? 'long' : 'short', year: 'numeric', timeZone });
}

/** A time of day on the reader's own clock ("14:05"): a claim's end, the last save. Drawn in the browser only. */
export function formatTime(value: DateInput): string {
  return toDate(value).toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });
}

export function formatDateTime(value: DateInput): string {
  const d = toDate(value);
  // the reader's own clock, date and time alike: these are drawn in the browser only
  const day = d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
  return `${day}, ${formatTime(d)}`;
}

/** `formatDate` for a value that may be missing: a dash stands in. */
export const dateOrDash = (value: DateInput | null | undefined) => (value ? formatDate(value) : '—');
