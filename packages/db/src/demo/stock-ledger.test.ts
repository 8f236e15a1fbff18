import { describe, expect, it } from 'vitest';
import { labourCents, StockLedger, type LedgerPart } from './stock-ledger.ts';

const fuse: LedgerPart = { id: 'fuse', unitCostCents: 40, supplier: 'Parts house', orderQuantity: 20 };
const solder: LedgerPart = { id: 'solder', unitCostCents: 9, supplier: 'Parts house', orderQuantity: 500 };

function ledger() {
  let n = 0;
  return new StockLedger('shelves', () => `m${++n}`);
}

/** Each stock's quantity as the movements add it up (counts set it). */
function replay(l: StockLedger): Map<string, number> {
  const totals = new Map<string, number>();
  const add = (at: string | null, part: string, q: number) => {
    if (at) totals.set(`${at}/${part}`, Math.round(((totals.get(`${at}/${part}`) ?? 0) + q) * 1000) / 1000);
  };
  for (const m of l.movements) {
    if (m.reason === 'counted') totals.set(`${m.toLocationId}/${m.cataloguePartId}`, m.countedQuantity!);
    else {
      add(m.fromLocationId, m.cataloguePartId, -m.quantity);
      add(m.toLocationId, m.cataloguePartId, m.quantity);
    }
  }
  return totals;
}

describe('the stock ledger of the invented data', () => {
  it('restocks a van from the shelves, and the shelves from an order, before a use would go below zero', () => {
    const l = ledger();
    l.receive(fuse, 3, 0);
    const used = l.use(fuse, 'van', 2, 10 * 3600_000, 'tech', { workOrderId: 'wo1' }, 5);
    // The van held none: 5 came from the shelves, which held 3 and so received an order of 20 first.
    expect(l.movements.map((m) => [m.reason, m.quantity])).toEqual([
      ['received', 3],
      ['received', 20],
      ['transfer', 5],
      ['used', 2],
    ]);
    expect(l.movements.at(-1)).toMatchObject({ id: used, fromLocationId: 'van', workOrderId: 'wo1', unitCostCents: 40 });
    expect({ shelves: l.quantity('shelves', 'fuse'), van: l.quantity('van', 'fuse') }).toEqual({ shelves: 18, van: 3 });
  });

  it('keeps a count’s expected and counted quantities, and the difference as the movement’s quantity', () => {
    const l = ledger();
    l.transfer(fuse, 'van', 4, 0, 'tech');
    l.count(fuse, 'van', 3, 3600_000, 'tech');
    expect(l.movements.at(-1)).toMatchObject({
      reason: 'counted',
      expectedQuantity: 4,
      countedQuantity: 3,
      quantity: 1,
      toLocationId: 'van',
    });
    expect(l.quantity('van', 'fuse')).toBe(3);
    expect(l.countedAt('van', 'fuse')).toEqual(new Date(3600_000));
  });

  it('reports levels that are exactly the movements’ totals, to three decimals', () => {
    const l = ledger();
    for (let i = 0; i < 40; i++) l.use(solder, i % 2 ? 'van1' : 'van2', 7.3, i * 3600_000, 'tech', { serviceCallId: `c${i}` }, 100);
    const levels = [...l.levels()];
    expect(levels).toHaveLength(3);
    const totals = replay(l);
    for (const level of levels) expect(level.quantity).toBe(totals.get(`${level.locationId}/${level.partId}`));
    for (const level of levels) expect(level.quantity).toBeGreaterThanOrEqual(0);
  });

  it('rounds labour at the hourly rate to the cent', () => {
    // 45 minutes at $52.00 an hour is $39.00; 50 minutes at $45.00 is $37.50; 7 minutes at $47.00 is $5.48 (5.4833…).
    expect([labourCents(45, 5200), labourCents(50, 4500), labourCents(7, 4700)]).toEqual([3900, 3750, 548]);
  });
});
