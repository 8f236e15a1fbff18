// A game's meters and their readings: which meters it has, the newest reading of each, the earliest in a window
// (for a usage rate), and recording one. Readings are never edited.
import { and, eq, gte, inArray, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { gameMeters, meterReadings } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

type MeterKind = (typeof meterReadings.$inferSelect)['meter'];

export async function listGameMeters(tx: Tx, gameId: string) {
  return tx
    .select({ meter: gameMeters.meter, rollsOverAt: gameMeters.rollsOverAt })
    .from(gameMeters)
    .where(and(eq(gameMeters.tenantId, currentTenant), eq(gameMeters.gameId, gameId)))
    .orderBy(gameMeters.meter);
}

/** The meters of several games at once (the care-plan run looks at a plan's games together). */
export async function listMetersOfGames(tx: Tx, gameIds: readonly string[]) {
  if (gameIds.length === 0) return [];
  return tx
    .select({ gameId: gameMeters.gameId, meter: gameMeters.meter, rollsOverAt: gameMeters.rollsOverAt })
    .from(gameMeters)
    .where(and(eq(gameMeters.tenantId, currentTenant), inArray(gameMeters.gameId, [...gameIds])));
}

/** Replaces the game's set of meters (readings of a meter taken off stay). */
export async function replaceGameMeters(tx: Tx, gameId: string, items: { meter: MeterKind; rollsOverAt: number | null }[]) {
  await tx.delete(gameMeters).where(and(eq(gameMeters.tenantId, currentTenant), eq(gameMeters.gameId, gameId)));
  if (items.length === 0) return;
  await tx.insert(gameMeters).values(items.map((m) => ({ ...m, gameId, tenantId: sql`${currentTenant}` })));
}

const readingColumns = {
  id: meterReadings.id,
  gameId: meterReadings.gameId,
  meter: meterReadings.meter,
  reading: meterReadings.reading,
  rolledOver: meterReadings.rolledOver,
  source: meterReadings.source,
  workOrderId: meterReadings.workOrderId,
  readAt: meterReadings.readAt,
  readBy: sql<{
    id: string;
    name: string;
  } | null>`(select json_build_object('id', u.id, 'name', u.name) from users u where u.id = meter_readings.read_by)`,
};

/** The newest reading of each meter of these games (one index walk per game and meter). */
export async function listLatestReadings(tx: Tx, gameIds: readonly string[]) {
  if (gameIds.length === 0) return [];
  return tx
    .selectDistinctOn([meterReadings.gameId, meterReadings.meter], readingColumns)
    .from(meterReadings)
    .where(and(eq(meterReadings.tenantId, currentTenant), inArray(meterReadings.gameId, [...gameIds])))
    .orderBy(meterReadings.gameId, meterReadings.meter, sql`${meterReadings.readAt} desc`, sql`${meterReadings.id} desc`);
}
export type MeterReadingRow = Awaited<ReturnType<typeof listLatestReadings>>[number];

/** The earliest reading of each meter of these games since `since`: with the newest, it gives a use per day. */
export async function listEarliestReadingsSince(tx: Tx, gameIds: readonly string[], since: Date) {
  if (gameIds.length === 0) return [];
  return tx
    .selectDistinctOn([meterReadings.gameId, meterReadings.meter], {
      gameId: meterReadings.gameId,
      meter: meterReadings.meter,
      reading: meterReadings.reading,
      readAt: meterReadings.readAt,
    })
    .from(meterReadings)
    .where(and(eq(meterReadings.tenantId, currentTenant), inArray(meterReadings.gameId, [...gameIds]), gte(meterReadings.readAt, since)))
    .orderBy(meterReadings.gameId, meterReadings.meter, meterReadings.readAt, meterReadings.id);
}

export async function insertMeterReading(tx: Tx, values: Omit<typeof meterReadings.$inferInsert, 'tenantId' | 'id'>) {
  const [row] = await tx
    .insert(meterReadings)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .returning({ id: meterReadings.id });
  const [reading] = await tx
    .select(readingColumns)
    .from(meterReadings)
    .where(and(eq(meterReadings.tenantId, currentTenant), eq(meterReadings.id, row!.id)));
  return reading!;
}
