/** Display formatting shared by pages, islands and the PDF; money is integer minor units. */

const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

export function formatDate(value: Date | number | null | undefined): string {
  if (value === null || value === undefined) return '—';
  return dateFormat.format(value instanceof Date ? value : new Date(value));
}

const timeFormat = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', timeZone: 'UTC', timeZoneName: 'short' });

/** A date with its time of day (UTC), for what happens within the day: a mail's next try. */
export function formatDateTime(value: Date | number): string {
  const at = value instanceof Date ? value : new Date(value);
  return `${formatDate(at)}, ${timeFormat.format(at)}`;
}

const localFormat = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
  timeZoneName: 'short',
});

/** A date and time of day in the time zone of whoever runs it: in a browser, the viewer's. */
export function formatLocalDateTime(value: Date | number): string {
  return localFormat.format(value instanceof Date ? value : new Date(value));
}

export function formatMoney(minor: number, currency: string): string {
  const digits = new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
  return new Intl.NumberFormat('en-GB', { style: 'currency', currency }).format(minor / 10 ** digits);
}
