// One company's parts and stock in the scale data: a catalogue (every distinct entry of its parts lists, the demo's
// route parts and, at the largest company, the many sizes and colours of rubbers, lamps, coils and switches a big
// route keeps — about 600 parts), fits to the parts-list entries, the shop's shelves and a van per technician, the
// movements through the shared stock ledger (so levels are the movements' totals, never below zero), parts used on
// done work orders and fixed calls, and one keep-cost row per job.
import { partKindLabels, type PartKind } from '@bumperline/contracts/bench-vocabulary';
import { callParts, electrolyticEntry, fuseEntry, routeParts, workOrderParts, type CatalogueEntry } from '../demo/stock.ts';
import { labourCents, StockLedger, type LedgerPart } from '../demo/stock-ledger.ts';
import type { Dice } from './dice.ts';
import type { ScaleTables } from './scale-tables.ts';

const DAY = 24 * 60 * 60_000;
/** The largest company's catalogue. */
const LARGEST_CATALOGUE = 600;
/** Stock (and so parts used, and a call's keep cost) is kept for the last year; work orders before it cost their labour. */
const STOCK_DAYS = 365;
/** Share of fixed calls that fitted a part from the van (the rest were adjustments, cleaning, resets). */
const CALLS_WITH_PARTS = 0.3;
/** The demo's parts per work order, thinned: at scale a plan's consumables are logged about every other visit. */
const WORK_ORDER_PARTS_SHARE = 0.5;

export interface StockContext {
  tables: ScaleTables;
  dice: Dice;
  now: number;
}

export interface StockCompany {
  tenantId: string;
  start: number;
  technicians: readonly { id: string; name: string }[];
  labourRateCents: number;
}

interface Part extends CatalogueEntry, LedgerPart {
  id: string;
}

/** Sizes and colours a big route stocks of the same few things (invented part numbers). */
const variantFamilies: [string, string, string[], string[], number][] = [
  [
    'RR',
    'Rubber ring',
    [
      '5/16 in',
      '3/8 in',
      '7/16 in',
      '1/2 in',
      '3/4 in',
      '1 in',
      '1-1/4 in',
      '1-1/2 in',
      '2 in',
      '2-1/2 in',
      '3 in',
      '3-1/2 in',
      '4 in',
      '5 in',
    ],
    ['white', 'black', 'red', 'blue', 'yellow'],
    40,
  ],
  [
    'LMP',
    'Lamp',
    ['#44 bayonet', '#47 bayonet', '#555 wedge', '#906 wedge', '#89 bayonet', '#1091 bayonet'],
    ['incandescent', 'LED warm white', 'LED cool white', 'LED red', 'LED blue', 'LED green'],
    60,
  ],
  ['CSL', 'Coil sleeve', ['1-3/8 in', '1-1/2 in', '1-5/8 in', '1-7/8 in', '2 in', '2-1/4 in'], ['nylon', 'brass'], 110],
  [
    'COIL',
    'Coil',
    ['23-800', '24-940', '25-1240', '26-1200', '27-1500', '32-1800', '22-1080', '23-1100'],
    ['with diode', 'without diode'],
    1850,
  ],
  [
    'SW',
    'Switch',
    ['leaf, 2 blade', 'leaf, 3 blade', 'micro, roller', 'micro, wire', 'micro, lever', 'optical pair', 'rollover wire', 'tilt bob'],
    ['gold contacts', 'silver contacts'],
    240,
  ],
  ['BTN', 'Button', ['round 28 mm', 'round 33 mm', 'square 30 mm', 'rectangle 50 mm'], ['red', 'white', 'yellow', 'green', 'blue'], 190],
  ['BLT', 'Drive belt', ['jukebox mechanism', 'bill acceptor', 'ticket dispenser', 'crane gantry'], ['short', 'long'], 1100],
  ['SEG', 'Dartboard segment', ['single inner', 'single outer', 'double', 'treble', 'bull'], ['red', 'black', 'white', 'green'], 310],
  ['RIB', 'Ribbon cable', ['10 way', '14 way', '20 way', '26 way', '34 way', '40 way'], ['300 mm', '600 mm'], 280],
  ['FAN', 'Cabinet fan', ['80 mm', '92 mm', '120 mm'], ['12 V DC', '120 V AC'], 1150],
  [
    'HSG',
    'Connector housing',
    ['2 pin', '3 pin', '4 pin', '5 pin', '6 pin', '7 pin', '8 pin', '9 pin', '10 pin', '12 pin', '13 pin', '15 pin', '18 pin', '20 pin'],
    ['.156 in', '.100 in'],
    60,
  ],
  [
    'TGT',
    'Standup target',
    ['round', 'square', 'rectangle', 'oval', 'triangle'],
    ['red', 'yellow', 'white', 'green', 'blue', 'orange'],
    650,
  ],
  ['BAT', 'Flipper bat with shaft', ['3 in', '2-1/2 in', '1-1/2 in'], ['white', 'yellow', 'red', 'black', 'blue', 'clear'], 780],
  [
    'SPR',
    'Spring',
    [
      'plunger',
      'coil return',
      'kickback',
      'flipper return',
      'drop target',
      'gate',
      'tilt bob',
      'coin door',
      'bill acceptor',
      'ball trough',
    ],
    ['light', 'standard', 'heavy'],
    85,
  ],
  ['SPK', 'Speaker', ['4 in', '5-1/4 in', '6 in', '6x9 in', '8 in'], ['4 Ω', '8 Ω', '16 Ω'], 1450],
  [
    'CKIT',
    'Capacitor kit for monitor chassis',
    ['K4600', 'K4900', 'K7000', 'G07', 'MS2930', 'VG2000', 'K5000', 'D9200', 'P1900', 'M3100'],
    ['full', 'power section only'],
    2400,
  ],
  [
    'PIN',
    'Crimp pins',
    ['.156 in trifurcon', '.156 in standard', '.100 in standard', '.093 in', 'spade 1/4 in', 'ring M4'],
    ['bag of 25', 'bag of 100', 'reel of 500', 'bag of 10'],
    350,
  ],
  [
    'SCR',
    'Screw',
    [
      '#6 x 1/2 in',
      '#6 x 3/4 in',
      '#8 x 1/2 in',
      '#8 x 3/4 in',
      '#8 x 1 in',
      '#10 x 1 in',
      'M3 x 8',
      'M4 x 10',
      '8-32 x 3/8 in',
      '6-32 x 1/4 in',
    ],
    ['zinc', 'black', 'stainless'],
    12,
  ],
];

/** A sortable, unique part number for a parts-list value: "4k7" → "4K7", "brown black orange gold" → "BROWN-BLACK-ORANGE-GOLD". */
const sanitize = (value: string) =>
  value
    .toUpperCase()
    .replace(/[^A-Z0-9.µΩ]+/g, '-')
    .replace(/^-|-$/g, '');

const kindPrefix: Partial<Record<PartKind, string>> = {
  resistor: 'RS',
  capacitor: 'CC',
  diode: 'DI',
  bridge_rectifier: 'BR',
  connector: 'HDR',
  transistor: 'TR',
  regulator: 'RG',
  other: 'OT',
};
const kindCost: Partial<Record<PartKind, [number, number]>> = {
  resistor: [5, 60],
  capacitor: [8, 40],
  diode: [5, 40],
  bridge_rectifier: [45, 400],
  connector: [150, 350],
  transistor: [20, 150],
  regulator: [50, 1500],
  other: [50, 2500],
};

export class CompanyStock {
  private readonly parts: Part[] = [];
  private readonly byNumber = new Map<string, Part>();
  private readonly fuses: Part[] = [];
  private readonly vans = new Map<string, string>();
  private readonly ledger: StockLedger;
  private readonly warehouseId: string;
  private readonly stockFrom: number;

  constructor(
    private readonly ctx: StockContext,
    private readonly company: StockCompany,
    entries: readonly { id: string; kind: string; value: string; rating: string }[],
    largest: boolean,
  ) {
    const { tables: t, dice } = ctx;
    this.stockFrom = Math.max(company.start, ctx.now - STOCK_DAYS * DAY);
    // The parts lists' own entries: at a small company only what a route carries for them (fuses, rectifiers,
    // filter electrolytics); at the largest, every distinct entry but test points.
    const entryKey = (e: { kind: string; value: string; rating: string }) =>
      `${e.kind}|${e.value}|${e.kind === 'electrolytic' ? e.rating : ''}`;
    const fitting = new Map<string, Part>();
    for (const e of entries) {
      const key = entryKey(e);
      if (fitting.has(key)) continue;
      const entry = this.entryFor(e, largest);
      if (entry) fitting.set(key, this.add(entry));
    }
    for (const entry of routeParts) this.add(entry);
    if (largest) {
      for (const [prefix, family, sizes, variants, cost] of variantFamilies) {
        for (const [i, size] of sizes.entries()) {
          for (const [j, variant] of variants.entries()) {
            if (this.parts.length >= LARGEST_CATALOGUE) break;
            this.add({
              partNumber: `${prefix}-${String(i + 1).padStart(2, '0')}${String(j + 1).padStart(2, '0')}`,
              description: `${family} ${size}, ${variant}`,
              kind: 'other',
              unit: 'each',
              unitCostCents: Math.round(cost * (0.8 + dice.float() * 0.5)),
              supplier: dice.pick(['Crown Coin-Op Parts', 'Ridgeway Trade Counter', 'Harlan Amusement Supply']),
              shelf: dice.int(5, 40),
            });
          }
        }
      }
    }
    const created = new Date(company.start - 10 * DAY);
    for (const part of this.parts) {
      t.catalogueParts.add({
        tenant_id: company.tenantId,
        id: part.id,
        part_number: part.partNumber,
        description: part.description,
        kind: part.kind,
        unit: part.unit,
        unit_cost_cents: part.unitCostCents,
        supplier: part.supplier,
        notes: part.notes ?? '',
        created_at: created,
        updated_at: created,
      });
    }
    for (const e of entries) {
      const part = fitting.get(entryKey(e));
      if (part) t.partFits.add({ tenant_id: company.tenantId, catalogue_part_id: part.id, board_part_id: e.id });
    }

    this.warehouseId = dice.uuid();
    t.stockLocations.add({
      tenant_id: company.tenantId,
      id: this.warehouseId,
      kind: 'warehouse',
      name: 'Shop shelves',
      technician_id: null,
      created_at: created,
    });
    for (const tech of company.technicians) {
      const id = dice.uuid();
      this.vans.set(tech.id, id);
      t.stockLocations.add({
        tenant_id: company.tenantId,
        id,
        kind: 'van',
        name: `${tech.name.split(' ')[0]}'s van`,
        technician_id: tech.id,
        created_at: created,
      });
    }
    this.ledger = new StockLedger(this.warehouseId, () => dice.uuid());
    for (const part of this.parts) this.ledger.receive(part, part.shelf, this.stockFrom);
    for (const [techId, van] of this.vans)
      for (const part of this.parts) if (part.van) this.ledger.transfer(part, van, part.van, this.stockFrom + DAY, techId);
    this.writeMovements();
  }

  private entryFor(e: { kind: string; value: string; rating: string }, largest: boolean): CatalogueEntry | undefined {
    const kind = e.kind as PartKind;
    if (kind === 'fuse') return fuseEntry(e.value);
    if (kind === 'electrolytic') {
      const microfarads = Number(e.value.replace('µF', ''));
      if (!Number.isFinite(microfarads) || (!largest && microfarads < 1000)) return undefined;
      return electrolyticEntry(e.value, e.rating, microfarads);
    }
    if (!largest && kind !== 'bridge_rectifier') return undefined;
    if (kind === 'other' && e.value.startsWith('test point')) return undefined;
    const [low, high] = kindCost[kind] ?? [20, 200];
    return {
      partNumber: `${kindPrefix[kind] ?? 'PT'}-${sanitize(e.value)}${kind === 'capacitor' && e.rating ? `-${sanitize(e.rating)}` : ''}`,
      description: `${partKindLabels[kind]} ${e.value}${e.rating ? ` ${e.rating}` : ''}`,
      kind,
      unit: 'each',
      unitCostCents: this.ctx.dice.int(low, high),
      supplier: 'Northfield Electronic Supply',
      shelf: kind === 'resistor' || kind === 'capacitor' || kind === 'diode' ? 100 : 10,
      van: kind === 'diode' ? 10 : undefined,
    };
  }

  private add(entry: CatalogueEntry): Part {
    const existing = this.byNumber.get(entry.partNumber.toLowerCase());
    if (existing) return existing;
    const part: Part = { ...entry, id: this.ctx.dice.uuid(), orderQuantity: entry.shelf };
    this.parts.push(part);
    this.byNumber.set(entry.partNumber.toLowerCase(), part);
    if (entry.kind === 'fuse') this.fuses.push(part);
    return part;
  }

  /** A done work order's parts (by its plan's usual ones) and its keep cost. */
  workOrderDone(w: { id: string; gameId: string; title: string; technicianId: string; at: number; labourMinutes: number }): void {
    const recipe = w.at < this.stockFrom ? [] : (workOrderParts.find(([title]) => w.title.startsWith(title))?.[1] ?? []);
    const parts = recipe.flatMap(([number, chance, low, high]) =>
      this.ctx.dice.chance(chance * WORK_ORDER_PARTS_SHARE) ? [{ part: this.byNumber.get(number.toLowerCase())!, low, high }] : [],
    );
    this.job(w.gameId, w.technicianId, w.at, w.labourMinutes, { workOrderId: w.id }, parts);
  }

  /** A fixed call's parts (by the problem reported; "fuse" is any fuse) and its keep cost. */
  callFixed(c: { id: string; gameId: string; technicianId: string; problem: string; at: number }): void {
    const { dice } = this.ctx;
    if (c.at < this.stockFrom) return;
    const recipe = callParts[c.problem] ?? [];
    const withParts = dice.chance(CALLS_WITH_PARTS);
    const parts = (withParts && recipe.length ? [dice.pick(recipe)] : []).flatMap(([number, low, high]) => {
      const part = number === 'fuse' ? (this.fuses.length ? dice.pick(this.fuses) : undefined) : this.byNumber.get(number.toLowerCase());
      return part ? [{ part, low, high }] : [];
    });
    this.job(c.gameId, c.technicianId, c.at, 20 + dice.int(0, 14) * 5, { serviceCallId: c.id }, parts);
  }

  private job(
    gameId: string,
    technicianId: string,
    at: number,
    labourMinutes: number,
    source: { workOrderId?: string; serviceCallId?: string },
    parts: { part: Part; low: number; high: number }[],
  ) {
    const { tables: t, dice } = this.ctx;
    const van = this.vans.get(technicianId);
    if (!van) return;
    let partsCents = 0;
    for (const { part, low, high } of parts) {
      const raw = low + dice.float() * (high - low);
      const quantity = part.unit === 'each' ? Math.max(1, Math.round(raw)) : Math.round(raw * 10) / 10;
      const movementId = this.ledger.use(part, van, quantity, at, technicianId, source, part.van ?? 0);
      t.partsUsed.add({
        tenant_id: this.company.tenantId,
        id: dice.uuid(),
        game_id: gameId,
        service_call_id: source.serviceCallId ?? null,
        work_order_id: source.workOrderId ?? null,
        catalogue_part_id: part.id,
        location_id: van,
        quantity,
        unit_cost_cents: part.unitCostCents,
        movement_id: movementId,
        used_at: new Date(at),
        used_by: technicianId,
      });
      partsCents += Math.round(quantity * part.unitCostCents);
    }
    this.writeMovements();
    t.keepCostEntries.add({
      tenant_id: this.company.tenantId,
      id: dice.uuid(),
      game_id: gameId,
      source: source.workOrderId ? 'work_order' : 'service_call',
      source_id: source.workOrderId ?? source.serviceCallId,
      parts_cents: partsCents,
      labour_minutes: labourMinutes,
      labour_rate_cents: this.company.labourRateCents,
      labour_cents: labourCents(labourMinutes, this.company.labourRateCents),
      technician_id: technicianId,
      recorded_at: new Date(at),
    });
  }

  /** A recent count of each van (a share of its parts, now and then one off), a few shelf parts run low, then the levels. */
  finish(): void {
    const { tables: t, dice, now } = this.ctx;
    for (const [techId, van] of this.vans) {
      const at = now - dice.int(1, 28) * DAY;
      for (const part of this.parts) {
        if (!part.van || part.unit !== 'each' || !dice.chance(0.4)) continue;
        const expected = this.ledger.quantity(van, part.id);
        this.ledger.count(part, van, Math.max(0, expected + (dice.chance(0.12) ? dice.pick([-1, -1, 1]) : 0)), at, techId);
      }
    }
    const firstVan = [...this.vans][0];
    if (firstVan) {
      for (const part of this.parts) {
        if (!dice.chance(0.04)) continue;
        const out = Math.floor(this.ledger.quantity(this.warehouseId, part.id) * 0.9);
        if (out > 0) this.ledger.transfer(part, firstVan[1], out, now - dice.int(1, 5) * DAY, firstVan[0]);
      }
    }
    this.writeMovements();
    const byId = new Map(this.parts.map((p) => [p.id, p]));
    for (const level of this.ledger.levels()) {
      const part = byId.get(level.partId)!;
      const shelf = level.locationId === this.warehouseId;
      t.stockLevels.add({
        tenant_id: this.company.tenantId,
        location_id: level.locationId,
        catalogue_part_id: level.partId,
        quantity: level.quantity,
        reorder_point: shelf ? Math.max(1, Math.round(part.shelf / 5)) : part.van ? Math.max(1, Math.round(part.van / 3)) : null,
        reorder_quantity: shelf ? part.shelf : (part.van ?? null),
        counted_at: this.ledger.countedAt(level.locationId, level.partId),
        updated_at: new Date(now - DAY),
      });
    }
  }

  /** Hands the ledger's new movements to COPY (before the parts used that point at them). */
  private writeMovements() {
    for (const m of this.ledger.movements.splice(0)) {
      this.ctx.tables.stockMovements.add({
        tenant_id: this.company.tenantId,
        id: m.id,
        catalogue_part_id: m.cataloguePartId,
        reason: m.reason,
        from_location_id: m.fromLocationId,
        to_location_id: m.toLocationId,
        quantity: m.quantity,
        expected_quantity: m.expectedQuantity,
        counted_quantity: m.countedQuantity,
        unit_cost_cents: m.unitCostCents,
        service_call_id: m.serviceCallId,
        work_order_id: m.workOrderId,
        note: m.note,
        at: m.at,
        by: m.by,
      });
    }
  }
}
