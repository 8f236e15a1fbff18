// How warm each game's cabinet runs through the day (slices of hours at a temperature), for capacitor life.
import { and, eq, inArray, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { cabinetProfiles, type CabinetSlice } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

const profileColumns = { gameId: cabinetProfiles.gameId, slices: cabinetProfiles.slices, updatedAt: cabinetProfiles.updatedAt };

export async function getCabinetProfile(tx: Tx, gameId: string) {
  const [row] = await tx
    .select(profileColumns)
    .from(cabinetProfiles)
    .where(and(eq(cabinetProfiles.tenantId, currentTenant), eq(cabinetProfiles.gameId, gameId)));
  return row;
}

/** The profiles of these games that have one (the recap list reads its games' with each board: board-instances.ts). */
export async function listCabinetProfiles(tx: Tx, gameIds: readonly string[]) {
  if (gameIds.length === 0) return [];
  return tx
    .select(profileColumns)
    .from(cabinetProfiles)
    .where(and(eq(cabinetProfiles.tenantId, currentTenant), inArray(cabinetProfiles.gameId, [...new Set(gameIds)])));
}

/** Sets a game's profile, replacing the one it had. */
export async function saveCabinetProfile(tx: Tx, gameId: string, slices: CabinetSlice[]) {
  const [row] = await tx
    .insert(cabinetProfiles)
    .values({ tenantId: sql`${currentTenant}`, gameId, slices })
    .onConflictDoUpdate({ target: [cabinetProfiles.tenantId, cabinetProfiles.gameId], set: { slices, updatedAt: new Date() } })
    .returning(profileColumns);
  return row!;
}
