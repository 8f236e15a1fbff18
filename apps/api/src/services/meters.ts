// Recording a meter reading: never lower than the last unless the game's meter rolls over and the person says it
// did (the domain's meterDelta checks the pair against the rollover point); a recorded reading makes the care plans
// covering the game look again at once.
import type { MeterKind, MeterReading, MeterReadingSource } from '@bumperline/contracts/meters';
import { meterKindLabels } from '@bumperline/contracts/meters';
import type { Tx } from '@bumperline/db/client';
import { checkCarePlansOfGameBy } from '@bumperline/db/queries/care-plans';
import { getGame } from '@bumperline/db/queries/games';
import { insertMeterReading, listGameMeters, listLatestReadings, type MeterReadingRow } from '@bumperline/db/queries/meters';
import { DomainError } from '@bumperline/domain/errors';
import { meterDelta } from '@bumperline/domain/meters/meter-delta';
import { InvalidInput, NotFound } from './workflow-errors.ts';

const count = new Intl.NumberFormat('en-US');

export function meterReadingView(row: MeterReadingRow): MeterReading {
  return { ...row, readAt: new Date(row.readAt).toISOString() };
}

export async function gameOrThrow(tx: Tx, gameId: string) {
  const game = await getGame(tx, gameId);
  if (!game) throw new NotFound('game');
  return game;
}

export async function recordMeterReading(
  tx: Tx,
  p: {
    gameId: string;
    meter: MeterKind;
    reading: number;
    rolledOver: boolean;
    source: MeterReadingSource;
    workOrderId?: string | null;
    readBy: string;
    /** Where the fields sit in the request ("readings.0." inside a work order's done). */
    fieldPrefix?: string;
    now?: Date;
  },
): Promise<MeterReading> {
  const field = (name: string) => `${p.fieldPrefix ?? ''}${name}`;
  await gameOrThrow(tx, p.gameId);
  const meters = await listGameMeters(tx, p.gameId);
  const declared = meters.find((m) => m.meter === p.meter);
  if (meters.length > 0 && !declared) {
    throw new InvalidInput([
      {
        field: field('meter'),
        message: `is not a meter of this game (it has ${meters.map((m) => meterKindLabels[m.meter].toLowerCase()).join(', ')})`,
      },
    ]);
  }
  const modulus = declared?.rollsOverAt ?? null;
  if (modulus !== null && p.reading >= modulus) {
    throw new InvalidInput([
      { field: field('reading'), message: `cannot be shown on this meter, which rolls over at ${count.format(modulus)}` },
    ]);
  }
  const last = (await listLatestReadings(tx, [p.gameId])).find((r) => r.meter === p.meter);
  let rolledOver = false;
  if (last && p.reading < last.reading) {
    if (!p.rolledOver || modulus === null) {
      const why =
        modulus === null
          ? 'this meter has no rollover point: if it was reset or replaced, say so in a note and ask the office to set its meters'
          : 'if the meter rolled over past its last digit, tick "rolled over"';
      throw new InvalidInput([
        { field: field('reading'), message: `is lower than the last reading (${count.format(last.reading)}); ${why}` },
      ]);
    }
    try {
      rolledOver = meterDelta(last.reading, p.reading, modulus).rolledOver;
    } catch (err) {
      if (err instanceof DomainError) throw new InvalidInput([{ field: field('reading'), message: err.message }]);
      throw err;
    }
  } else if (p.rolledOver) {
    throw new InvalidInput([
      {
        field: field('rolledOver'),
        message: last
          ? `cannot be: the reading is not lower than the last (${count.format(last.reading)})`
          : 'cannot be: there is no earlier reading',
      },
    ]);
  }
  const row = await insertMeterReading(tx, {
    gameId: p.gameId,
    meter: p.meter,
    reading: p.reading,
    rolledOver,
    source: p.source,
    workOrderId: p.workOrderId ?? null,
    readBy: p.readBy,
    readAt: p.now ?? new Date(),
  });
  await checkCarePlansOfGameBy(tx, p.gameId, p.now ?? new Date());
  return meterReadingView(row);
}
