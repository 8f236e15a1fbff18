// The running stock of invented data (the demo's and the scale data's): every movement is recorded with the quantity
// it leaves at each stock, so the levels written at the end are exactly the movements' totals and never below zero.
// A van short of a part is restocked from the shelves first; shelves short of it receive an order first.

export interface LedgerPart {
  id: string;
  unitCostCents: number;
  supplier: string;
  /** How many the shelves order at a time. */
  orderQuantity: number;
}

export interface LedgerMovement {
  id: string;
  cataloguePartId: string;
  reason: 'received' | 'transfer' | 'used' | 'counted';
  fromLocationId: string | null;
  toLocationId: string | null;
  quantity: number;
  expectedQuantity: number | null;
  countedQuantity: number | null;
  unitCostCents: number;
  serviceCallId: string | null;
  workOrderId: string | null;
  at: Date;
  by: string | null;
  note: string;
}

const HOUR = 3600_000;
/** Quantities have three decimals (metres, grams, millilitres): sums are rounded to them so no float dust builds up. */
const round3 = (n: number) => Math.round(n * 1000) / 1000;

export class StockLedger {
  private readonly held = new Map<string, number>();
  private readonly lastCount = new Map<string, Date>();
  readonly movements: LedgerMovement[] = [];

  constructor(
    private readonly warehouseId: string,
    private readonly newId: () => string,
  ) {}

  quantity(locationId: string, partId: string): number {
    return this.held.get(`${locationId}/${partId}`) ?? 0;
  }

  /** When the part was last counted at the stock, if ever. */
  countedAt(locationId: string, partId: string): Date | null {
    return this.lastCount.get(`${locationId}/${partId}`) ?? null;
  }

  /** Every stock and part that has held something, with its quantity now. */
  *levels(): Generator<{ locationId: string; partId: string; quantity: number }> {
    for (const [key, quantity] of this.held) {
      const [locationId, partId] = key.split('/') as [string, string];
      yield { locationId, partId, quantity };
    }
  }

  receive(part: LedgerPart, quantity: number, at: number): string {
    this.change(this.warehouseId, part.id, quantity);
    return this.record(part, { reason: 'received', toLocationId: this.warehouseId, quantity, at, note: `From ${part.supplier}` });
  }

  /** From the shelves to a van (ordering first if the shelves are short). */
  transfer(part: LedgerPart, toLocationId: string, quantity: number, at: number, by: string | null): string {
    if (this.quantity(this.warehouseId, part.id) < quantity) this.receive(part, Math.max(part.orderQuantity, quantity), at - HOUR);
    this.change(this.warehouseId, part.id, -quantity);
    this.change(toLocationId, part.id, quantity);
    return this.record(part, { reason: 'transfer', fromLocationId: this.warehouseId, toLocationId, quantity, at, by });
  }

  /** Fitted on a job from a van; a van without enough is restocked with `restock` (at least what is needed) first. */
  use(
    part: LedgerPart,
    vanId: string,
    quantity: number,
    at: number,
    by: string | null,
    job: { serviceCallId?: string | null; workOrderId?: string | null },
    restock: number,
  ): string {
    if (this.quantity(vanId, part.id) < quantity) this.transfer(part, vanId, Math.max(restock, quantity), at - 2 * HOUR, by);
    this.change(vanId, part.id, -quantity);
    return this.record(part, {
      reason: 'used',
      fromLocationId: vanId,
      quantity,
      at,
      by,
      serviceCallId: job.serviceCallId ?? null,
      workOrderId: job.workOrderId ?? null,
    });
  }

  /** A count: the stock is what was counted; the movement keeps what it said before. */
  count(part: LedgerPart, locationId: string, counted: number, at: number, by: string | null): string {
    const expected = this.quantity(locationId, part.id);
    this.held.set(`${locationId}/${part.id}`, counted);
    this.lastCount.set(`${locationId}/${part.id}`, new Date(at));
    return this.record(part, {
      reason: 'counted',
      toLocationId: locationId,
      quantity: round3(Math.abs(counted - expected)),
      expectedQuantity: expected,
      countedQuantity: counted,
      at,
      by,
      note: counted < expected ? 'Short at the count.' : counted > expected ? 'More than expected at the count.' : '',
    });
  }

  private change(locationId: string, partId: string, delta: number) {
    const key = `${locationId}/${partId}`;
    const next = round3((this.held.get(key) ?? 0) + delta);
    if (next < 0) throw new Error(`stock ledger: ${partId} at ${locationId} would go below zero`);
    this.held.set(key, next);
  }

  private record(
    part: LedgerPart,
    m: Partial<Omit<LedgerMovement, 'at'>> & Pick<LedgerMovement, 'reason' | 'quantity'> & { at: number },
  ): string {
    const id = this.newId();
    this.movements.push({
      id,
      cataloguePartId: part.id,
      fromLocationId: null,
      toLocationId: null,
      expectedQuantity: null,
      countedQuantity: null,
      unitCostCents: part.unitCostCents,
      serviceCallId: null,
      workOrderId: null,
      by: null,
      note: '',
      ...m,
      at: new Date(m.at),
    });
    return id;
  }
}

/** Labour at an hourly rate for the minutes on site, to the cent (keep cost). */
export const labourCents = (minutes: number, rateCents: number) => Math.round((minutes * rateCents) / 60);
