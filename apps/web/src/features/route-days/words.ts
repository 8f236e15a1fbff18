// How the route-day screen says distances and moves between dates (durations: formatMinutes in lib/duration-entry.ts).

/** "14.5 km", in the company's locale. */
export function formatKm(km: number, locale = 'en-US'): string {
  return `${new Intl.NumberFormat(locale, { maximumFractionDigits: 1 }).format(km)} km`;
}

/** The date a day away from `day` (YYYY-MM-DD), for the previous/next buttons. */
export function shiftDay(day: string, by: number): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(Date.UTC(y!, m! - 1, d! + by)).toISOString().slice(0, 10);
}
