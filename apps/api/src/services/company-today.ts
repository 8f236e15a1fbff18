// "Today" as the company's calendar has it: the date on the wall in its time zone (a Chicago company's evening is
// already tomorrow in UTC).
import type { Tx } from '@bumperline/db/client';
import { getCompanyLocale } from '@bumperline/db/queries/companies';
import { epochDayFromParts, formatPlainDate } from '@bumperline/domain/plain-date';
import { wallTimeAt } from '@bumperline/domain/schedules/zoned-time';

/** YYYY-MM-DD in `timeZone` at `now`. */
export function dateInZone(timeZone: string, now: Date = new Date()): string {
  const wall = wallTimeAt(now.getTime(), timeZone);
  return formatPlainDate(epochDayFromParts(wall.year, wall.month, wall.day));
}

export async function companyToday(tx: Tx, tenantId: string, now: Date = new Date()): Promise<string> {
  const company = await getCompanyLocale(tx, tenantId);
  return dateInZone(company?.timeZone ?? 'UTC', now);
}
