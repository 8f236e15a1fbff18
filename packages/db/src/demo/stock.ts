// The demo company's parts and stock: a catalogue of the parts a route actually uses (the fuses, filter
// electrolytics, rectifiers and regulators of the demo parts lists, fitted to those entries; rubbers, coil sleeves,
// lamps, coin-door and dart parts, belts, solder), from invented suppliers; the shop's shelves and a van per
// technician; six months of movements (received, moved to vans, used on jobs, counted with small differences)
// whose running totals are the stock levels; the parts used on done work orders and fixed calls, and one keep-cost
// row per job: parts at the cost when used plus labour at the company's rate.
import { and, eq, gte, isNotNull } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import {
  boardParts,
  catalogueParts,
  gameModels,
  games,
  keepCostEntries,
  modelBoards,
  partFits,
  partsUsed,
  serviceCalls,
  stockLevels,
  stockLocations,
  stockMovements,
  technicianProfiles,
  tenantSettings,
  users,
} from '../schema/index.ts';
import type { DoneWorkOrder } from './care-plans.ts';
import { demoBoards } from './parts-lists.ts';
import { labourCents, StockLedger } from './stock-ledger.ts';

const HOUR = 3600_000;
const DAY = 24 * HOUR;
/** The company has kept its stock in Bumperline for this long. */
const STOCK_DAYS = 180;

type Kind = (typeof catalogueParts.$inferInsert)['kind'];
type Unit = 'each' | 'm' | 'g' | 'ml';

export interface CatalogueEntry {
  partNumber: string;
  description: string;
  kind: Kind;
  unit: Unit;
  unitCostCents: number;
  supplier: string;
  /** Parts-list entries it fits: same kind and value (and rating, for electrolytics). */
  fits?: { value: string; rating?: string };
  /** Carried on the vans, and how many. */
  van?: number;
  /** The shop's opening stock. */
  shelf: number;
  notes?: string;
}

// Invented suppliers.
const ELECTRONICS = 'Northfield Electronic Supply';
const COIN_OP = 'Crown Coin-Op Parts';
const GENERAL = 'Ridgeway Trade Counter';

/** IEC 60127 markings: T is time-lag, F is quick-acting; all 5 × 20 mm glass. */
export function fuseEntry(marking: string): CatalogueEntry {
  const [rating] = marking.split(' ');
  const speed = rating!.startsWith('T') ? 'time-lag' : 'quick-acting';
  return {
    partNumber: `FU-${rating}`,
    description: `Fuse ${marking} 5×20 mm ${speed}`,
    kind: 'fuse',
    unit: 'each',
    unitCostCents: 35 + (rating!.length % 3) * 8,
    supplier: ELECTRONICS,
    fits: { value: marking },
    van: 10,
    shelf: 60,
  };
}

export function electrolyticEntry(value: string, rating: string, microfarads: number): CatalogueEntry {
  const volts = Number(rating.replace(/[^0-9.]/g, ''));
  return {
    partNumber: `EC-${value.replace('µF', 'U')}-${volts}V`,
    description: `Electrolytic ${value} ${rating} 105 °C`,
    kind: 'electrolytic',
    unit: 'each',
    // Bigger cans cost more: a 22,000 µF filter cap is a few dollars, a 100 µF one under a dollar.
    unitCostCents: Math.round(60 + Math.sqrt(microfarads * volts) * 2.2),
    supplier: ELECTRONICS,
    fits: { value, rating },
    van: microfarads <= 1000 ? 4 : undefined,
    shelf: microfarads >= 10000 ? 8 : 15,
    notes: 'Replace with 105 °C parts of the same or higher voltage.',
  };
}

const bridges: [string, string, number][] = [
  ['KBPC3506', '35 A 600 V bridge rectifier, spade terminals', 395],
  ['GBPC2504', '25 A 400 V bridge rectifier', 310],
  ['GBPC3504', '35 A 400 V bridge rectifier', 345],
  ['KBP206', '2 A 600 V bridge rectifier, in-line', 65],
  ['KBU808', '8 A 800 V bridge rectifier', 120],
  ['W04M', '1.5 A 400 V round bridge rectifier', 45],
];
const diodes: [string, string, number][] = [
  ['1N4004', 'Rectifier diode 1 A 400 V', 8],
  ['1N4007', 'Rectifier diode 1 A 1000 V', 9],
  ['1N4148', 'Small-signal diode 100 V', 5],
  ['1N5401', 'Rectifier diode 3 A 100 V', 22],
  ['1N5822', 'Schottky diode 3 A 40 V', 38],
];
const semis: [string, Kind, string, number][] = [
  ['LM7812', 'regulator', '+12 V 1 A regulator, TO-220', 55],
  ['LM7805', 'regulator', '+5 V 1 A regulator, TO-220', 50],
  ['LM323K', 'regulator', '+5 V 3 A regulator, TO-3 can', 1450],
  ['TIP102', 'transistor', 'Darlington transistor, solenoid driver', 95],
  ['TIP42C', 'transistor', 'PNP power transistor', 70],
];

/** Parts a route goes through that no parts list names: rubbers, lamps, coin and dart parts, consumables. */
export const routeParts: CatalogueEntry[] = [
  {
    partNumber: 'RB-RING-2',
    description: 'Rubber ring 2 in, white',
    kind: 'other',
    unit: 'each',
    unitCostCents: 45,
    supplier: COIN_OP,
    van: 20,
    shelf: 150,
  },
  {
    partNumber: 'RB-RING-3',
    description: 'Rubber ring 3 in, white',
    kind: 'other',
    unit: 'each',
    unitCostCents: 55,
    supplier: COIN_OP,
    van: 15,
    shelf: 120,
  },
  {
    partNumber: 'RB-FLIP-15',
    description: 'Flipper rubber 1½ in, red',
    kind: 'other',
    unit: 'each',
    unitCostCents: 65,
    supplier: COIN_OP,
    van: 8,
    shelf: 60,
  },
  {
    partNumber: 'RB-POST',
    description: 'Post rubber 7/16 in',
    kind: 'other',
    unit: 'each',
    unitCostCents: 20,
    supplier: COIN_OP,
    van: 20,
    shelf: 200,
  },
  {
    partNumber: 'CL-SLEEVE',
    description: 'Coil sleeve, nylon, 1⅞ in',
    kind: 'other',
    unit: 'each',
    unitCostCents: 90,
    supplier: COIN_OP,
    van: 6,
    shelf: 40,
  },
  {
    partNumber: 'CL-STOP',
    description: 'Coil stop with bracket',
    kind: 'other',
    unit: 'each',
    unitCostCents: 420,
    supplier: COIN_OP,
    van: 2,
    shelf: 12,
  },
  {
    partNumber: 'CL-PLUNGER',
    description: 'Flipper plunger and link',
    kind: 'other',
    unit: 'each',
    unitCostCents: 1150,
    supplier: COIN_OP,
    shelf: 8,
  },
  {
    partNumber: 'LP-44',
    description: 'Lamp #44, 6.3 V bayonet',
    kind: 'other',
    unit: 'each',
    unitCostCents: 30,
    supplier: COIN_OP,
    van: 25,
    shelf: 200,
  },
  {
    partNumber: 'LP-555',
    description: 'Lamp #555, 6.3 V wedge',
    kind: 'other',
    unit: 'each',
    unitCostCents: 25,
    supplier: COIN_OP,
    van: 25,
    shelf: 200,
  },
  {
    partNumber: 'LED-555-WW',
    description: 'LED wedge #555, warm white, non-ghosting',
    kind: 'other',
    unit: 'each',
    unitCostCents: 85,
    supplier: COIN_OP,
    van: 10,
    shelf: 100,
  },
  {
    partNumber: 'LP-906',
    description: 'Flasher lamp #906, 13 V wedge',
    kind: 'other',
    unit: 'each',
    unitCostCents: 75,
    supplier: COIN_OP,
    van: 6,
    shelf: 40,
  },
  {
    partNumber: 'BALL-1116',
    description: 'Pinball 1-1/16 in, chromed steel',
    kind: 'other',
    unit: 'each',
    unitCostCents: 180,
    supplier: COIN_OP,
    van: 4,
    shelf: 30,
  },
  {
    partNumber: 'CLN-PF',
    description: 'Playfield cleaner',
    kind: 'other',
    unit: 'ml',
    unitCostCents: 2,
    supplier: GENERAL,
    van: 500,
    shelf: 4000,
  },
  {
    partNumber: 'WAX-PF',
    description: 'Playfield wax',
    kind: 'other',
    unit: 'g',
    unitCostCents: 4,
    supplier: GENERAL,
    van: 200,
    shelf: 1500,
  },
  {
    partNumber: 'CLN-CONTACT',
    description: 'Contact cleaner, no residue',
    kind: 'other',
    unit: 'ml',
    unitCostCents: 3,
    supplier: GENERAL,
    van: 300,
    shelf: 2000,
  },
  {
    partNumber: 'CM-COMP',
    description: 'Electronic coin comparator, US quarter',
    kind: 'other',
    unit: 'each',
    unitCostCents: 2450,
    supplier: COIN_OP,
    van: 1,
    shelf: 6,
  },
  {
    partNumber: 'CM-SW',
    description: 'Coin door micro switch with wire actuator',
    kind: 'other',
    unit: 'each',
    unitCostCents: 160,
    supplier: COIN_OP,
    van: 4,
    shelf: 30,
  },
  {
    partNumber: 'CM-COUNTER',
    description: 'Coin counter, 6-digit, 12 V coil',
    kind: 'other',
    unit: 'each',
    unitCostCents: 890,
    supplier: COIN_OP,
    shelf: 6,
  },
  {
    partNumber: 'DT-TIPS',
    description: 'Soft dart tips, 2BA, pack of 100',
    kind: 'other',
    unit: 'each',
    unitCostCents: 650,
    supplier: COIN_OP,
    van: 3,
    shelf: 25,
  },
  {
    partNumber: 'DT-SEG',
    description: 'Dartboard segment, single, red/black',
    kind: 'other',
    unit: 'each',
    unitCostCents: 310,
    supplier: COIN_OP,
    van: 6,
    shelf: 40,
  },
  {
    partNumber: 'JB-BELT',
    description: 'Jukebox mechanism drive belt',
    kind: 'other',
    unit: 'each',
    unitCostCents: 1275,
    supplier: COIN_OP,
    van: 1,
    shelf: 8,
  },
  {
    partNumber: 'JB-BUTTON',
    description: 'Selector button with lamp',
    kind: 'other',
    unit: 'each',
    unitCostCents: 540,
    supplier: COIN_OP,
    shelf: 20,
  },
  {
    partNumber: 'FAN-120',
    description: 'Cabinet fan 120 mm, 120 V AC',
    kind: 'other',
    unit: 'each',
    unitCostCents: 1390,
    supplier: GENERAL,
    shelf: 6,
  },
  {
    partNumber: 'SOLDER-63',
    description: 'Solder 63/37 leaded, 0.8 mm',
    kind: 'other',
    unit: 'g',
    unitCostCents: 9,
    supplier: ELECTRONICS,
    van: 100,
    shelf: 1000,
    notes: 'Contains lead: wash hands after handling.',
  },
  {
    partNumber: 'WIRE-18',
    description: 'Hook-up wire 18 AWG, stranded',
    kind: 'other',
    unit: 'm',
    unitCostCents: 40,
    supplier: ELECTRONICS,
    van: 10,
    shelf: 200,
  },
  {
    partNumber: 'HDR-156-9',
    description: '.156 in header, 9 pins, with housing and crimp pins',
    kind: 'connector',
    unit: 'each',
    unitCostCents: 260,
    supplier: ELECTRONICS,
    van: 2,
    shelf: 20,
    fits: { value: '.156 in header, 9 pins' },
  },
  {
    partNumber: 'HDR-156-12',
    description: '.156 in header, 12 pins, with housing and crimp pins',
    kind: 'connector',
    unit: 'each',
    unitCostCents: 310,
    supplier: ELECTRONICS,
    shelf: 10,
    fits: { value: '.156 in header, 12 pins' },
  },
  {
    partNumber: 'HDR-156-6',
    description: '.156 in header, 6 pins, with housing and crimp pins',
    kind: 'connector',
    unit: 'each',
    unitCostCents: 210,
    supplier: ELECTRONICS,
    shelf: 10,
    fits: { value: '.156 in header, 6 pins' },
  },
];

/** The catalogue: the demo parts lists' fuses, rectifiers, filter electrolytics and common semiconductors, then the route's own parts. */
export function demoCatalogue(): CatalogueEntry[] {
  const fuses = new Set<string>();
  const caps = new Map<string, { value: string; rating: string; microfarads: number }>();
  for (const board of demoBoards) {
    for (const part of board.parts) {
      if (part.kind === 'fuse') fuses.add(part.value);
      const microfarads = Number(part.value.replace('µF', ''));
      // The filter cans and the mid-size ones a recap always needs; the small ones come from a kit.
      if (part.kind === 'electrolytic' && (microfarads >= 1000 || (microfarads >= 100 && Number.parseInt(part.rating) >= 50)))
        caps.set(`${part.value} ${part.rating}`, { value: part.value, rating: part.rating, microfarads });
    }
  }
  return [
    ...[...fuses].sort().map(fuseEntry),
    ...[...caps.values()].map((c) => electrolyticEntry(c.value, c.rating, c.microfarads)),
    ...bridges.map(([value, description, cost]) => ({
      partNumber: `BR-${value}`,
      description,
      kind: 'bridge_rectifier' as const,
      unit: 'each' as const,
      unitCostCents: cost,
      supplier: ELECTRONICS,
      fits: { value },
      van: value === 'KBPC3506' ? 2 : undefined,
      shelf: 10,
      notes: 'Mount raised off the board with heat-sink compound where it bolts down.',
    })),
    ...diodes.map(([value, description, cost]) => ({
      partNumber: `DI-${value}`,
      description,
      kind: 'diode' as const,
      unit: 'each' as const,
      unitCostCents: cost,
      supplier: ELECTRONICS,
      fits: { value },
      van: 20,
      shelf: 200,
    })),
    ...semis.map(([value, kind, description, cost]) => ({
      partNumber: `${kind === 'regulator' ? 'RG' : 'TR'}-${value}`,
      description,
      kind,
      unit: 'each' as const,
      unitCostCents: cost,
      supplier: ELECTRONICS,
      fits: { value },
      van: value === 'TIP102' ? 3 : undefined,
      shelf: value === 'LM323K' ? 4 : 15,
    })),
    ...routeParts,
  ];
}

/** What a done work order of each plan fits, by its title's first words: [part number, chance, lowest, highest]. */
export const workOrderParts: [string, [string, number, number, number][]][] = [
  [
    'Monthly playfield clean',
    [
      ['CLN-PF', 1, 40, 80],
      ['WAX-PF', 0.8, 10, 25],
      ['RB-RING-2', 0.5, 1, 4],
      ['RB-POST', 0.4, 2, 6],
      ['LP-555', 0.3, 1, 3],
    ],
  ],
  [
    'Flipper rebuild',
    [
      ['CL-SLEEVE', 1, 2, 2],
      ['CL-STOP', 0.6, 1, 2],
      ['CL-PLUNGER', 0.3, 1, 2],
      ['RB-FLIP-15', 0.9, 2, 2],
    ],
  ],
  [
    'Quarterly coin mech',
    [
      ['CLN-CONTACT', 1, 20, 40],
      ['CM-SW', 0.2, 1, 1],
      ['CM-COMP', 0.05, 1, 1],
    ],
  ],
  [
    'Jukebox yearly',
    [
      ['JB-BELT', 0.6, 1, 1],
      ['JB-BUTTON', 0.3, 1, 2],
      ['CLN-CONTACT', 1, 20, 50],
    ],
  ],
  [
    'Dartboard segment',
    [
      ['DT-SEG', 0.8, 1, 3],
      ['DT-TIPS', 0.5, 1, 1],
    ],
  ],
  [
    'Fan and playfield lamp',
    [
      ['LP-44', 0.8, 2, 6],
      ['LED-555-WW', 0.4, 2, 6],
      ['FAN-120', 0.08, 1, 1],
    ],
  ],
];

/** What a fixed call used, by the problem reported: [part number, lowest, highest]; "fuse" is one of the game's own. */
export const callParts: Record<string, [string, number, number][]> = {
  dead: [
    ['fuse', 1, 2],
    ['BR-KBPC3506', 1, 1],
    ['HDR-156-9', 1, 1],
  ],
  no_credit: [
    ['CM-SW', 1, 1],
    ['CM-COMP', 1, 1],
    ['CLN-CONTACT', 10, 30],
  ],
  ball_stuck: [
    ['RB-RING-2', 1, 2],
    ['CL-SLEEVE', 1, 1],
    ['BALL-1116', 1, 1],
  ],
  no_sound: [
    ['fuse', 1, 1],
    ['CLN-CONTACT', 10, 20],
  ],
  display_out: [
    ['LP-44', 2, 4],
    ['LED-555-WW', 2, 6],
    ['fuse', 1, 1],
  ],
  other: [
    ['WIRE-18', 0.5, 2],
    ['SOLDER-63', 5, 15],
    ['LP-906', 1, 2],
  ],
};

interface Use {
  at: number;
  technicianId: string;
  gameId: string;
  workOrderId: string | null;
  serviceCallId: string | null;
  parts: { partNumber: string; quantity: number }[];
  labourMinutes: number;
}

export async function seedStock(tx: Tx, p: { tenantId: string; now: Date; doneWorkOrders: readonly DoneWorkOrder[]; rand: () => number }) {
  const { tenantId, rand } = p;
  const now = p.now.getTime();
  const stockFrom = now - STOCK_DAYS * DAY;
  const between = (low: number, high: number, unit: Unit) => {
    const q = low + rand() * (high - low);
    return unit === 'each' ? Math.round(q) : Math.round(q * 10) / 10;
  };

  const catalogue = demoCatalogue().map((entry) => ({ ...entry, id: crypto.randomUUID() }));
  const byNumber = new Map(catalogue.map((c) => [c.partNumber, c]));
  await tx.insert(catalogueParts).values(
    catalogue.map((c) => ({
      tenantId,
      id: c.id,
      partNumber: c.partNumber,
      description: c.description,
      kind: c.kind,
      unit: c.unit,
      unitCostCents: c.unitCostCents,
      supplier: c.supplier,
      notes: c.notes ?? '',
      createdAt: new Date(stockFrom - 10 * DAY),
      updatedAt: new Date(stockFrom - 10 * DAY),
    })),
  );

  // Fits: every parts-list entry of the same kind and value (and rating, for an electrolytic).
  const entries = await tx
    .select({ id: boardParts.id, kind: boardParts.kind, value: boardParts.value, rating: boardParts.rating, boardId: boardParts.boardId })
    .from(boardParts)
    .where(eq(boardParts.tenantId, tenantId));
  const fits = entries.flatMap((e) => {
    const part = catalogue.find(
      (c) => c.fits && c.kind === e.kind && c.fits.value === e.value && (c.fits.rating === undefined || c.fits.rating === e.rating),
    );
    return part ? [{ tenantId, cataloguePartId: part.id, boardPartId: e.id }] : [];
  });
  if (fits.length) await tx.insert(partFits).values(fits);

  // Where stock is kept: the shop's shelves and a van per technician.
  const warehouseId = crypto.randomUUID();
  const vans = new Map<string, string>();
  const vanTechs = await technicianRows(tx, tenantId);
  await tx.insert(stockLocations).values([
    { tenantId, id: warehouseId, kind: 'warehouse', name: 'Shop shelves', createdAt: new Date(stockFrom - 10 * DAY) },
    ...vanTechs.map((t) => {
      const id = crypto.randomUUID();
      vans.set(t.id, id);
      return {
        tenantId,
        id,
        kind: 'van' as const,
        name: `${t.name.split(' ')[0]}'s van`,
        technicianId: t.id,
        createdAt: new Date(stockFrom - 10 * DAY),
      };
    }),
  ]);

  // The jobs that used parts since stock was kept: done work orders, and a share of fixed calls.
  const uses: Use[] = [];
  for (const w of p.doneWorkOrders) {
    if (w.closedAt.getTime() < stockFrom || !w.technicianId) continue;
    const recipe = workOrderParts.find(([title]) => w.title.startsWith(title))?.[1] ?? [];
    const parts = recipe.flatMap(([partNumber, chance, low, high]) =>
      rand() < chance ? [{ partNumber, quantity: between(low, high, byNumber.get(partNumber)!.unit) }] : [],
    );
    uses.push({
      at: w.closedAt.getTime(),
      technicianId: w.technicianId,
      gameId: w.gameId,
      workOrderId: w.id,
      serviceCallId: null,
      parts,
      labourMinutes: w.labourMinutes,
    });
  }
  const fixedCalls = await tx
    .select({
      id: serviceCalls.id,
      gameId: serviceCalls.gameId,
      technicianId: serviceCalls.technicianId,
      problem: serviceCalls.problem,
      fixedAt: serviceCalls.fixedAt,
      modelId: games.modelId,
    })
    .from(serviceCalls)
    .innerJoin(games, and(eq(games.tenantId, serviceCalls.tenantId), eq(games.id, serviceCalls.gameId)))
    .where(and(eq(serviceCalls.tenantId, tenantId), isNotNull(serviceCalls.fixedAt), gte(serviceCalls.fixedAt, new Date(stockFrom))));
  const fusesByModel = await modelFuses(tx, tenantId);
  for (const call of fixedCalls) {
    if (!call.technicianId || !vans.has(call.technicianId)) continue;
    const recipe = callParts[call.problem] ?? [];
    const parts = recipe.flatMap(([partNumber, low, high]) => {
      if (rand() > 0.45) return [];
      const number = partNumber === 'fuse' ? pickFrom(fusesByModel.get(call.modelId) ?? ['T2.5A 250V'], rand) : partNumber;
      const part = partNumber === 'fuse' ? byNumber.get(`FU-${number.split(' ')[0]}`) : byNumber.get(number);
      return part ? [{ partNumber: part.partNumber, quantity: between(low, high, part.unit) }] : [];
    });
    uses.push({
      at: call.fixedAt!.getTime() - 10 * 60_000,
      technicianId: call.technicianId,
      gameId: call.gameId,
      workOrderId: null,
      serviceCallId: call.id,
      parts,
      labourMinutes: 20 + Math.round(rand() * 14) * 5,
    });
  }
  uses.sort((a, b) => a.at - b.at);

  // The movements, in time order, through the ledger: its totals are the stock levels, never below zero.
  const ledger = new StockLedger(warehouseId, () => crypto.randomUUID());
  const asLedgerPart = (part: (typeof catalogue)[number]) => ({ ...part, orderQuantity: part.shelf });
  for (const part of catalogue) ledger.receive(asLedgerPart(part), part.shelf, stockFrom);
  for (const [techId, van] of vans)
    for (const part of catalogue)
      if (part.van) ledger.transfer(asLedgerPart(part), van, part.van, stockFrom + DAY + rand() * 4 * HOUR, techId);

  const usedRows: (typeof partsUsed.$inferInsert)[] = [];
  const keepCosts: (typeof keepCostEntries.$inferInsert)[] = [];
  const [settings] = await tx
    .select({ rate: tenantSettings.labourRateCents })
    .from(tenantSettings)
    .where(eq(tenantSettings.tenantId, tenantId));
  const rate = settings?.rate ?? 4500;
  let nextCount = stockFrom + 30 * DAY;
  for (const use of uses) {
    // Every month or so each van is counted: a few parts, and now and then one or two off.
    if (use.at > nextCount) {
      for (const [techId, van] of vans) {
        for (const part of catalogue.filter((c) => c.van && c.unit === 'each')) {
          if (rand() > 0.3) continue;
          const expected = ledger.quantity(van, part.id);
          const counted = Math.max(0, expected + (rand() < 0.15 ? (rand() < 0.7 ? -1 : 1) : 0));
          ledger.count(asLedgerPart(part), van, counted, nextCount + 16 * HOUR, techId);
        }
      }
      nextCount += (28 + Math.floor(rand() * 7)) * DAY;
    }
    const van = vans.get(use.technicianId)!;
    let partsCents = 0;
    for (const { partNumber, quantity } of use.parts) {
      const part = byNumber.get(partNumber)!;
      const job = { serviceCallId: use.serviceCallId, workOrderId: use.workOrderId };
      const movementId = ledger.use(asLedgerPart(part), van, quantity, use.at, use.technicianId, job, part.van ?? 0);
      usedRows.push({
        tenantId,
        gameId: use.gameId,
        ...job,
        cataloguePartId: part.id,
        locationId: van,
        quantity,
        unitCostCents: part.unitCostCents,
        movementId,
        usedAt: new Date(use.at),
        usedBy: use.technicianId,
      });
      partsCents += Math.round(quantity * part.unitCostCents);
    }
    keepCosts.push({
      tenantId,
      gameId: use.gameId,
      source: use.workOrderId ? 'work_order' : 'service_call',
      sourceId: (use.workOrderId ?? use.serviceCallId)!,
      partsCents,
      labourMinutes: use.labourMinutes,
      labourRateCents: rate,
      labourCents: labourCents(use.labourMinutes, rate),
      technicianId: use.technicianId,
      recordedAt: new Date(use.at),
    });
  }
  // Done work orders from before stock was kept still cost their labour.
  for (const w of p.doneWorkOrders) {
    if (w.closedAt.getTime() >= stockFrom || !w.technicianId) continue;
    keepCosts.push({
      tenantId,
      gameId: w.gameId,
      source: 'work_order',
      sourceId: w.id,
      partsCents: 0,
      labourMinutes: w.labourMinutes,
      labourRateCents: rate,
      labourCents: labourCents(w.labourMinutes, rate),
      technicianId: w.technicianId,
      recordedAt: w.closedAt,
    });
  }

  // A few shelf parts ran low: most went out to the vans three days ago and the order is not in yet.
  const low = new Set(['FU-T2.5A', 'LP-44', 'CL-SLEEVE', 'RB-RING-2', 'DT-SEG']);
  for (const part of catalogue.filter((c) => low.has(c.partNumber))) {
    const each = Math.floor((ledger.quantity(warehouseId, part.id) - 1) / Math.max(1, vans.size));
    if (each > 0) for (const [techId, van] of vans) ledger.transfer(asLedgerPart(part), van, each, now - 3 * DAY, techId);
  }
  // Levels are the ledger's totals. The shelves reorder a part at about a fifth of their usual stock, a van at a third of its load.
  const levels: (typeof stockLevels.$inferInsert)[] = [];
  for (const part of catalogue) {
    levels.push({
      tenantId,
      locationId: warehouseId,
      cataloguePartId: part.id,
      quantity: ledger.quantity(warehouseId, part.id),
      reorderPoint: Math.max(1, Math.round(part.shelf / 5)),
      reorderQuantity: part.shelf,
      updatedAt: new Date(now - DAY),
    });
    for (const [, van] of vans) {
      if (!part.van && ledger.quantity(van, part.id) === 0) continue;
      levels.push({
        tenantId,
        locationId: van,
        cataloguePartId: part.id,
        quantity: ledger.quantity(van, part.id),
        reorderPoint: part.van ? Math.max(1, Math.round(part.van / 3)) : null,
        reorderQuantity: part.van ?? null,
        countedAt: ledger.countedAt(van, part.id),
        updatedAt: new Date(now - DAY),
      });
    }
  }

  const movements = ledger.movements.map((m) => ({ ...m, tenantId }));
  for (let i = 0; i < movements.length; i += 500) await tx.insert(stockMovements).values(movements.slice(i, i + 500));
  await tx.insert(stockLevels).values(levels);
  for (let i = 0; i < usedRows.length; i += 500) await tx.insert(partsUsed).values(usedRows.slice(i, i + 500));
  for (let i = 0; i < keepCosts.length; i += 500) await tx.insert(keepCostEntries).values(keepCosts.slice(i, i + 500));
}

async function technicianRows(tx: Tx, tenantId: string) {
  return tx
    .select({ id: users.id, name: users.name })
    .from(technicianProfiles)
    .innerJoin(users, eq(users.id, technicianProfiles.userId))
    .where(eq(technicianProfiles.tenantId, tenantId))
    .orderBy(users.email);
}

/** Each model's fuse markings, from its boards' parts lists. */
async function modelFuses(tx: Tx, tenantId: string): Promise<Map<string, string[]>> {
  const rows = await tx
    .select({ modelId: gameModels.id, value: boardParts.value })
    .from(boardParts)
    .innerJoin(modelBoards, and(eq(modelBoards.tenantId, boardParts.tenantId), eq(modelBoards.id, boardParts.boardId)))
    .innerJoin(gameModels, and(eq(gameModels.tenantId, modelBoards.tenantId), eq(gameModels.id, modelBoards.modelId)))
    .where(and(eq(boardParts.tenantId, tenantId), eq(boardParts.kind, 'fuse')));
  const out = new Map<string, string[]>();
  for (const r of rows) out.set(r.modelId, [...(out.get(r.modelId) ?? []), r.value]);
  return out;
}

const pickFrom = <T>(items: readonly T[], rand: () => number) => items[Math.floor(rand() * items.length)]!;
