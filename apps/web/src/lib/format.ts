// Dates and money in the operator company's locale and time zone.
export interface LocaleSettings {
  locale: string;
  timeZone: string;
  currency: string;
}

export const defaultLocale: LocaleSettings = { locale: 'en-US', timeZone: 'America/Chicago', currency: 'USD' };

export function formatDate(iso: string | null | undefined, s: LocaleSettings = defaultLocale): string {
  if (!iso) return '—';
  // A plain date (YYYY-MM-DD) is a calendar day, not an instant: do not shift it by time zone.
  if (/^\d{4}-\d{2}-\d{2}$/.test(iso)) {
    const [y, m, d] = iso.split('-').map(Number);
    return new Intl.DateTimeFormat(s.locale, { dateStyle: 'medium', timeZone: 'UTC' }).format(new Date(Date.UTC(y!, m! - 1, d!)));
  }
  return new Intl.DateTimeFormat(s.locale, { dateStyle: 'medium', timeZone: s.timeZone }).format(new Date(iso));
}

export function formatDateTime(iso: string | null | undefined, s: LocaleSettings = defaultLocale): string {
  if (!iso) return '—';
  return new Intl.DateTimeFormat(s.locale, { dateStyle: 'medium', timeStyle: 'short', timeZone: s.timeZone }).format(new Date(iso));
}

/** A message from the API or the domain ("must be …", "reads low …") as a sentence on its own. */
export const asSentence = (text: string): string => text.charAt(0).toUpperCase() + text.slice(1);

export function formatMoney(cents: number, s: LocaleSettings = defaultLocale): string {
  return new Intl.NumberFormat(s.locale, { style: 'currency', currency: s.currency }).format(cents / 100);
}
