// The boards the scale data's models carry: the demo's invented parts lists (power supplies, a sound board, a
// driver board) and larger invented lists drawn from a seeded mix of parts (logic boards, game boards, amplifiers),
// up to a 400-part main board. Each part is read once here by the domain's readPartEntry, so the readings the scale
// data writes are judged against the same specs the bench uses.
import type { PartKind } from '@bumperline/contracts/bench-vocabulary';
import { readPartEntry, type PartSpec } from '@bumperline/domain/components/parts-list-entry';
import { demoBoards, type DemoPart } from '../demo/parts-lists.ts';
import { seededRandom } from '../demo/random.ts';
import type { ModelKind } from './scale-names.ts';

export interface BoardDesign {
  name: string;
  partNumber: string;
  notes: string;
  parts: readonly DemoPart[];
  /** Each part as the domain reads it (null where it does not read, which no design here has). */
  specs: readonly (PartSpec | null)[];
  /** Positions (in `parts`) of the resistors a bench measures: 10 Ω or more, with a tolerance. */
  measurable: readonly number[];
}

function design(name: string, partNumber: string, notes: string, parts: readonly DemoPart[]): BoardDesign {
  const specs = parts.map((p) => {
    try {
      return readPartEntry(p);
    } catch {
      return null;
    }
  });
  const measurable = specs.flatMap((s, i) =>
    // Below 10 Ω a meter's leads matter more than the part: nobody charts those.
    s && s.kind === 'resistor' && s.nominal !== null && s.nominal >= 10 && s.tolerance !== null ? [i] : [],
  );
  return { name, partNumber, notes, parts, specs, measurable };
}

const fromDemo = (modelTitle: string, name: string): BoardDesign => {
  const board = demoBoards.find((b) => b.modelTitle === modelTitle && b.name === name);
  if (!board) throw new Error(`the demo has no ${name} for ${modelTitle}`);
  return design(board.name, board.partNumber, board.notes, board.parts);
};

const blank = { tolerance: '', rating: '', ratedTemperatureC: null, ratedLifeHours: null, notes: '' };
const resistorValues = ['4k7', '10k', '1k', '220', '470', '2k2', '47k', '100k', '330', '1k5', '68k', '22R', '100R', '1M', '3k3', '8k2'];
const resistorBands = ['brown black red gold', 'yellow violet red gold', 'red red orange silver', 'brown black orange gold'];
const ceramicValues = ['100nF', '104', '10nF', '4n7', '22pF', '470pF', '1nF', '103'];
const electrolyticValues: readonly [string, string][] = [
  ['100µF', '25 V'],
  ['47µF', '16 V'],
  ['10µF', '50 V'],
  ['1000µF', '16 V'],
  ['2200µF', '25 V'],
  ['470µF', '35 V'],
  ['4.7µF', '63 V'],
];
const chips = ['74LS244', '74LS138', '74LS374', 'ULN2803', '6809 CPU', '27C512 EPROM', '6821 PIA', '6264 RAM', 'LM339', 'NE555'];
const transistors = ['2N3904', '2N3906', 'TIP102', 'BC547', '2N5401', 'TIP36C'];

/** Of every 100 parts on an invented board, so many of each kind (the rest: fuses, a bridge). */
const mix: readonly [PartKind, number][] = [
  ['resistor', 40],
  ['capacitor', 18],
  ['electrolytic', 8],
  ['diode', 8],
  ['transistor', 8],
  ['other', 10],
  ['connector', 4],
  ['regulator', 2],
];

/** An invented board of `size` parts, the same on every run (its own seed). */
function invented(name: string, partNumber: string, notes: string, size: number, seed: number): BoardDesign {
  const random = seededRandom(seed);
  const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)]!;
  const next: Record<string, number> = {};
  const designator = (prefix: string) => `${prefix}${(next[prefix] = (next[prefix] ?? 0) + 1)}`;
  const parts: DemoPart[] = [
    { ...blank, designator: designator('F'), kind: 'fuse', value: 'T2A 250V', notes: 'board supply' },
    { ...blank, designator: designator('F'), kind: 'fuse', value: 'F1A 250V' },
    { ...blank, designator: designator('BR'), kind: 'bridge_rectifier', value: 'W04M', rating: '1.5 A 400 V' },
  ];
  for (const [kind, share] of mix) {
    const count = Math.max(1, Math.round(((size - 3) * share) / 100));
    for (let i = 0; i < count && parts.length < size; i++) {
      if (kind === 'resistor') {
        const banded = random() < 0.2;
        parts.push({
          ...blank,
          designator: designator('R'),
          kind,
          value: banded ? pick(resistorBands) : pick(resistorValues),
          tolerance: banded ? '' : pick(['5%', '5%', '1%', 'J']),
          rating: pick(['1/4 W', '1/4 W', '1/2 W', '1 W']),
        });
      } else if (kind === 'capacitor') {
        parts.push({
          ...blank,
          designator: designator('C'),
          kind,
          value: pick(ceramicValues),
          tolerance: pick(['10%', 'K', '20%']),
          rating: pick(['50 V', '100 V']),
        });
      } else if (kind === 'electrolytic') {
        const [value, rating] = pick(electrolyticValues);
        parts.push({
          ...blank,
          designator: designator('C'),
          kind,
          value,
          tolerance: '±20%',
          rating,
          ratedTemperatureC: pick([85, 85, 105]),
          ratedLifeHours: pick([1000, 2000, 2000, 3000, 5000]),
        });
      } else if (kind === 'diode') {
        const [value, rating] = pick([
          ['1N4148', '100 V'],
          ['1N4004', '1 A 400 V'],
        ] as const);
        parts.push({ ...blank, designator: designator('D'), kind, value, rating });
      } else if (kind === 'transistor') {
        parts.push({ ...blank, designator: designator('Q'), kind, value: pick(transistors) });
      } else if (kind === 'other') {
        parts.push({ ...blank, designator: designator('U'), kind, value: pick(chips), notes: random() < 0.1 ? 'socketed' : '' });
      } else if (kind === 'connector') {
        parts.push({
          ...blank,
          designator: designator('J'),
          kind,
          value: pick(['.100 in header, 10 pins', '.156 in header, 9 pins', '.100 in header, 26 pins']),
        });
      } else {
        parts.push({ ...blank, designator: designator('U'), kind, value: pick(['LM7805', 'LM7812', 'LM317T']) });
      }
    }
  }
  // Round off to exactly `size` with resistors, the commonest part.
  while (parts.length < size)
    parts.push({ ...blank, designator: designator('R'), kind: 'resistor', value: pick(resistorValues), tolerance: '5%', rating: '1/4 W' });
  return design(name, partNumber, notes, parts.slice(0, size));
}

const powerSupplies = {
  comet: fromDemo('Comet Carnival', 'Power supply'),
  rodeo: fromDemo('Midnight Rodeo', 'Power supply'),
  courier: fromDemo('Star Courier', 'Power supply'),
  wallbox: fromDemo('Wallbox 120', 'Power supply'),
};
const allSupplies = Object.values(powerSupplies);

/** A model's first board is always its power supply, of one of these designs. */
export const powerSupplyDesigns: Readonly<Record<ModelKind, readonly BoardDesign[]>> = {
  pinball: [powerSupplies.comet, powerSupplies.rodeo],
  video: [powerSupplies.courier],
  jukebox: [powerSupplies.wallbox],
  darts: allSupplies,
  other: allSupplies,
};

/** Its second and third boards, by the kind of game. */
export const otherBoardDesigns: Readonly<Record<ModelKind, readonly BoardDesign[]>> = {
  pinball: [
    fromDemo('Deep Sea Salvage', 'Driver board'),
    fromDemo('Comet Carnival', 'Sound board'),
    invented('CPU board', 'SC-CPU-210', 'The game logic: CPU, ROMs, RAM with its battery and the switch matrix.', 160, 11),
  ],
  video: [
    invented('Game board', 'SC-GB-300', 'The game itself: CPU, video and sound on one board.', 220, 12),
    invented('Monitor chassis', 'SC-MC-19', 'Deflection and video amplifier of the 19 in monitor.', 120, 13),
  ],
  jukebox: [
    invented('Amplifier', 'SC-AMP-60', 'Stereo amplifier, 60 W a channel.', 80, 14),
    invented('Selector board', 'SC-SEL-12', 'Keypad, selection display and credit logic.', 50, 15),
  ],
  darts: [
    invented('Main board', 'SC-DB-100', 'Target matrix, scoring and coin logic.', 130, 16),
    invented('Display board', 'SC-DD-20', 'Score displays and their drivers.', 45, 17),
  ],
  other: [
    invented('Control board', 'SC-CB-40', 'Claw and gantry motor control, coin and prize logic.', 90, 18),
    invented('Bill acceptor interface', 'SC-BA-02', 'Pulses from the bill acceptor to the coin input.', 35, 19),
  ],
};

/** The largest company's few big boards: a main board of 400 parts (logic, drivers and lamp matrix on one board). */
export const mainBoard400 = invented(
  'Main logic board',
  'SC-ML-400',
  'Logic, solenoid drivers and the lamp matrix on one board: the longest parts list on the route.',
  400,
  20,
);
