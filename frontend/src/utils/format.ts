const dateTimeFormat = new Intl.DateTimeFormat('en-GB', {
  year: 'numeric',
  month: 'short',
  day: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
});
const dateFormat = new Intl.DateTimeFormat('en-GB', { year: 'numeric', month: 'short', day: 'numeric' });

function parse(iso: string | null | undefined): Date | null {
  if (!iso) return null;
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? null : date;
}

/** "3 Mar 2026, 14:05" in the viewer's time zone; an em dash for a missing or invalid value. */
export function formatDateTime(iso: string | null | undefined): string {
  const date = parse(iso);
  return date ? dateTimeFormat.format(date) : '—';
}

/** "3 Mar 2026"; an em dash for a missing or invalid value. */
export function formatDate(iso: string | null | undefined): string {
  const date = parse(iso);
  return date ? dateFormat.format(date) : '—';
}

/** Capitalises the first letter: `analyst` → `Analyst`. */
export function capitalize(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
