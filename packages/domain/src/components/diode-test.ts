import { DomainError } from '../errors.ts';
import { describe, requireNonNegative } from '../input-checks.ts';

/**
 * Diode-test readings as a multimeter shows them: the forward drop in volts, or OL when nothing conducts. A good
 * silicon junction reads about 0.5–0.8 V forward and OL reversed; near 0 V both ways is shorted; OL both ways is
 * open (DMM manuals' diode-test function; the ranges are common practice and adjustable).
 */

export type DiodeReading = number | 'OL';

export interface DiodeRanges {
  junctionMinVolts: number;
  junctionMaxVolts: number;
  /** At or below this a junction counts as shorted. */
  shortedMaxVolts: number;
  /** Two silicon junctions in series, as a bridge reads from − to +. */
  seriesPairMinVolts: number;
  seriesPairMaxVolts: number;
}

export const SILICON_RANGES: DiodeRanges = {
  junctionMinVolts: 0.5,
  junctionMaxVolts: 0.8,
  shortedMaxVolts: 0.1,
  seriesPairMinVolts: 1.0,
  seriesPairMaxVolts: 1.4,
};

/** What one reading, in one direction, shows. */
export type ReadingClass = 'open' | 'shorted' | 'junction' | 'low' | 'high';

export function readDiodeReading(value: unknown, field = 'reading'): DiodeReading {
  if (typeof value === 'string') {
    const text = value.trim().toUpperCase().replace(/\./g, '');
    if (text === 'OL' || text === '0L') return 'OL';
    throw new DomainError('unparseable', `${describe(value)} is not a diode-test reading: give volts or OL`, field);
  }
  return requireNonNegative(value, field);
}

function requireRanges(ranges: DiodeRanges): DiodeRanges {
  const keys = ['shortedMaxVolts', 'junctionMinVolts', 'junctionMaxVolts', 'seriesPairMinVolts', 'seriesPairMaxVolts'] as const;
  for (const key of keys) requireNonNegative(ranges?.[key], `ranges.${key}`);
  if (!(ranges.shortedMaxVolts < ranges.junctionMinVolts && ranges.junctionMinVolts <= ranges.junctionMaxVolts)) {
    throw new DomainError('out-of-range', 'ranges must run shorted < junction minimum ≤ junction maximum', 'ranges');
  }
  if (ranges.seriesPairMinVolts > ranges.seriesPairMaxVolts) {
    throw new DomainError('inverted-period', 'the series-pair range runs backwards', 'ranges');
  }
  return ranges;
}

export function classifyReading(value: DiodeReading, ranges: DiodeRanges = SILICON_RANGES): ReadingClass {
  requireRanges(ranges);
  const reading = readDiodeReading(value);
  if (reading === 'OL') return 'open';
  if (reading <= ranges.shortedMaxVolts) return 'shorted';
  if (reading < ranges.junctionMinVolts) return 'low';
  if (reading > ranges.junctionMaxVolts) return 'high';
  return 'junction';
}

export type DiodeVerdict = 'good' | 'open' | 'shorted' | 'leaky' | 'reversed' | 'out-of-range';

export interface DiodeJudgement {
  verdict: DiodeVerdict;
  reason: string;
}

/** `forward`: red probe on the anode, black on the cathode; `reverse`: the other way round. */
export function judgeDiode(forward: DiodeReading, reverse: DiodeReading, ranges: DiodeRanges = SILICON_RANGES): DiodeJudgement {
  const f = classifyReading(readDiodeReading(forward, 'forward'), ranges);
  const r = classifyReading(readDiodeReading(reverse, 'reverse'), ranges);
  const shown = `forward ${forward === 'OL' ? 'OL' : `${forward} V`}, reverse ${reverse === 'OL' ? 'OL' : `${reverse} V`}`;
  if (f === 'shorted' || r === 'shorted') return { verdict: 'shorted', reason: `near 0 V (${shown}): shorted` };
  if (f === 'open' && r === 'open') return { verdict: 'open', reason: `OL both ways: open` };
  if (f === 'junction' && r === 'open') return { verdict: 'good', reason: `one junction forward, OL reversed (${shown})` };
  if (f === 'open' && r === 'junction') {
    return { verdict: 'reversed', reason: `conducts only cathode to anode (${shown}): probes or part the wrong way round` };
  }
  if (r !== 'open') return { verdict: 'leaky', reason: `conducts in reverse (${shown}): leaky` };
  return {
    verdict: 'out-of-range',
    reason: `forward drop outside ${ranges.junctionMinVolts}–${ranges.junctionMaxVolts} V (${shown}): not a healthy silicon junction`,
  };
}

export type BridgeTerminal = 'AC1' | 'AC2' | '+' | '-';

export interface ProbeReading {
  red: BridgeTerminal;
  black: BridgeTerminal;
  value: DiodeReading;
}

/** The four diodes of a full bridge, named anode → cathode. */
export const BRIDGE_LEGS = [
  { name: 'AC1→+', anode: 'AC1', cathode: '+' },
  { name: 'AC2→+', anode: 'AC2', cathode: '+' },
  { name: '-→AC1', anode: '-', cathode: 'AC1' },
  { name: '-→AC2', anode: '-', cathode: 'AC2' },
] as const satisfies ReadonlyArray<{ name: string; anode: BridgeTerminal; cathode: BridgeTerminal }>;

export type BridgeLegName = (typeof BRIDGE_LEGS)[number]['name'];

export interface BridgeLegResult extends DiodeJudgement {
  leg: BridgeLegName;
  forward: DiodeReading;
  reverse: DiodeReading;
}

export interface BridgeCheck {
  name: 'AC1↔AC2' | '-→+';
  ok: boolean;
  reason: string;
}

export interface BridgeJudgement {
  /** bad: a leg failed; suspect: every leg passed but a cross-check did not. */
  verdict: 'good' | 'bad' | 'suspect';
  legs: BridgeLegResult[];
  badLegs: BridgeLegName[];
  checks: BridgeCheck[];
}

const TERMINALS: readonly BridgeTerminal[] = ['AC1', 'AC2', '+', '-'];

function indexReadings(readings: readonly ProbeReading[]): Map<string, DiodeReading> {
  if (!Array.isArray(readings)) throw new DomainError('missing-input', 'readings must be a list of probe readings', 'readings');
  const byPair = new Map<string, DiodeReading>();
  readings.forEach((r, i) => {
    const field = `readings[${i}]`;
    if (!TERMINALS.includes(r?.red) || !TERMINALS.includes(r?.black) || r.red === r.black) {
      throw new DomainError('unknown-code', `${field}: probes must be on two different terminals of AC1, AC2, + and -`, field);
    }
    const key = `${r.red}>${r.black}`;
    const value = readDiodeReading(r.value, `${field}.value`);
    const earlier = byPair.get(key);
    if (earlier !== undefined && earlier !== value) {
      throw new DomainError(
        'conflicting-input',
        `${field}: red on ${r.red}, black on ${r.black} was read twice with different values`,
        field,
      );
    }
    byPair.set(key, value);
  });
  return byPair;
}

function required(byPair: Map<string, DiodeReading>, red: BridgeTerminal, black: BridgeTerminal): DiodeReading {
  const value = byPair.get(`${red}>${black}`);
  if (value === undefined) {
    throw new DomainError('missing-input', `missing the reading with red on ${red} and black on ${black}`, 'readings');
  }
  return value;
}

/**
 * A full-bridge rectifier judged from its readings. Each AC terminal reads one junction towards + and from −, OL the
 * other way; AC1 to AC2 is OL both ways; − to + reads two junctions in series (≈1.0–1.4 V, common practice).
 * The eight leg readings are required; the AC-to-AC and −/+ readings are cross-checks when given.
 */
export function judgeBridgeRectifier(readings: readonly ProbeReading[], ranges: DiodeRanges = SILICON_RANGES): BridgeJudgement {
  const byPair = indexReadings(readings);
  const legs: BridgeLegResult[] = BRIDGE_LEGS.map(({ name, anode, cathode }) => {
    const forward = required(byPair, anode, cathode);
    const reverse = required(byPair, cathode, anode);
    return { leg: name, forward, reverse, ...judgeDiode(forward, reverse, ranges) };
  });
  const badLegs = legs.filter((l) => l.verdict !== 'good').map((l) => l.leg);

  const checks: BridgeCheck[] = [];
  const acForward = byPair.get('AC1>AC2');
  const acReverse = byPair.get('AC2>AC1');
  if (acForward !== undefined || acReverse !== undefined) {
    const open = [acForward, acReverse].every((v) => v === undefined || v === 'OL');
    checks.push({
      name: 'AC1↔AC2',
      ok: open,
      reason: open ? 'OL between the AC terminals, as expected' : 'conducts between the AC terminals: a leg is shorted or leaky',
    });
  }
  const pair = byPair.get('->+');
  const pairReverse = byPair.get('+>-');
  if (pair !== undefined || pairReverse !== undefined) {
    const inRange = pair === undefined || (pair !== 'OL' && pair >= ranges.seriesPairMinVolts && pair <= ranges.seriesPairMaxVolts);
    const reverseOpen = pairReverse === undefined || pairReverse === 'OL';
    const ok = inRange && reverseOpen;
    checks.push({
      name: '-→+',
      ok,
      reason: ok
        ? 'two junctions in series from − to +, OL the other way'
        : `expected ${ranges.seriesPairMinVolts}–${ranges.seriesPairMaxVolts} V from − to + and OL from + to −`,
    });
  }

  const verdict = badLegs.length > 0 ? 'bad' : checks.every((c) => c.ok) ? 'good' : 'suspect';
  return { verdict, legs, badLegs, checks };
}
