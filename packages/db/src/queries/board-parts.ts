// A board's parts list, scoped by the caller's tenant transaction. A designator names a place on the board, so
// a save matches rows by designator: a part is never deleted, only taken off the list (removed_at), because the
// readings taken on it point at it; listing the designator again brings the same row back with its history.
import { and, asc, eq, isNull, notInArray, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { boardParts } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

export interface BoardPartFields {
  designator: string;
  kind: (typeof boardParts.$inferInsert)['kind'];
  value: string;
  tolerance: string;
  rating: string;
  ratedTemperatureC: number | null;
  ratedLifeHours: number | null;
  notes: string;
}

export const boardPartColumns = {
  id: boardParts.id,
  designator: boardParts.designator,
  kind: boardParts.kind,
  value: boardParts.value,
  tolerance: boardParts.tolerance,
  rating: boardParts.rating,
  ratedTemperatureC: boardParts.ratedTemperatureC,
  ratedLifeHours: boardParts.ratedLifeHours,
  notes: boardParts.notes,
};

export type BoardPartRow = BoardPartFields & { id: string };

/** The parts on the board's list now, in list order. */
export function listBoardParts(tx: Tx, boardId: string): Promise<BoardPartRow[]> {
  return tx
    .select(boardPartColumns)
    .from(boardParts)
    .where(and(eq(boardParts.tenantId, currentTenant), eq(boardParts.boardId, boardId), isNull(boardParts.removedAt)))
    .orderBy(asc(boardParts.position), asc(boardParts.designator));
}

export interface PartsListChanges {
  /** Designators new to the board. */
  added: string[];
  /** Designators taken off the list earlier and listed again (the same rows, with their readings). */
  restored: string[];
  /** Designators taken off the list by this save. */
  removed: string[];
}

// 10 columns a row: 500 rows stay far below PostgreSQL's 65,535 parameters per statement.
const ROWS_PER_STATEMENT = 500;

/**
 * Makes `parts` (in order) the board's list: rows whose designator the board has are updated (and restored when
 * they had been removed), new designators are inserted, and designators no longer listed are marked removed.
 * The caller checks the list first (no duplicate designators) and holds the board's version.
 */
export async function replaceBoardParts(tx: Tx, boardId: string, parts: readonly BoardPartFields[]): Promise<PartsListChanges> {
  const before = await tx
    .select({ designator: boardParts.designator, removedAt: boardParts.removedAt })
    .from(boardParts)
    .where(and(eq(boardParts.tenantId, currentTenant), eq(boardParts.boardId, boardId)));
  const known = new Map(before.map((p) => [p.designator, p.removedAt]));
  const listed = new Set(parts.map((p) => p.designator));

  for (let start = 0; start < parts.length; start += ROWS_PER_STATEMENT) {
    const chunk = parts.slice(start, start + ROWS_PER_STATEMENT);
    await tx
      .insert(boardParts)
      .values(chunk.map((p, i) => ({ ...p, tenantId: sql`${currentTenant}`, boardId, position: start + i + 1, removedAt: null })))
      .onConflictDoUpdate({
        target: [boardParts.tenantId, boardParts.boardId, boardParts.designator],
        set: {
          position: sql`excluded.position`,
          kind: sql`excluded.kind`,
          value: sql`excluded.value`,
          tolerance: sql`excluded.tolerance`,
          rating: sql`excluded.rating`,
          ratedTemperatureC: sql`excluded.rated_temperature_c`,
          ratedLifeHours: sql`excluded.rated_life_hours`,
          notes: sql`excluded.notes`,
          removedAt: null,
        },
      });
  }

  const gone = await tx
    .update(boardParts)
    .set({ removedAt: new Date() })
    .where(
      and(
        eq(boardParts.tenantId, currentTenant),
        eq(boardParts.boardId, boardId),
        isNull(boardParts.removedAt),
        listed.size ? notInArray(boardParts.designator, [...listed]) : undefined,
      ),
    )
    .returning({ designator: boardParts.designator });

  return {
    added: parts.filter((p) => !known.has(p.designator)).map((p) => p.designator),
    restored: parts.filter((p) => known.get(p.designator)).map((p) => p.designator),
    removed: gone.map((p) => p.designator),
  };
}
