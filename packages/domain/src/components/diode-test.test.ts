import { describe, expect, it } from 'vitest';
import {
  classifyReading,
  judgeBridgeRectifier,
  judgeDiode,
  type BridgeTerminal,
  type DiodeReading,
  type ProbeReading,
} from './diode-test.ts';

// Ranges: silicon junction ≈ 0.5–0.8 V forward and OL reversed; near 0 V both ways = shorted; OL both ways = open
// (the diode-test function as multimeter makers describe it, e.g. Fluke, "How to test diodes using a digital
// multimeter", application article; figures from memory). Two junctions in series read 1.0–1.4 V: common practice.

describe('judgeDiode', () => {
  it.each([
    [0.62, 'OL', 'good'],
    [0.5, 'OL', 'good'],
    [0.8, 'OL', 'good'],
    ['OL', 'OL', 'open'],
    [0.01, 0.01, 'shorted'],
    [0, 0, 'shorted'],
    ['OL', 0.6, 'reversed'],
    [0.6, 1.1, 'leaky'],
    [0.25, 'OL', 'out-of-range'], // a Schottky or germanium part, or a damaged junction
    [1.9, 'OL', 'out-of-range'], // an LED or several junctions
  ] as Array<[DiodeReading, DiodeReading, string]>)('forward %s, reverse %s → %s', (forward, reverse, verdict) => {
    expect(judgeDiode(forward, reverse).verdict).toBe(verdict);
  });

  it('accepts the ways meters show over-range ("OL", "O.L", "0L") and refuses other text', () => {
    expect(classifyReading('O.L' as DiodeReading)).toBe('open');
    expect(classifyReading('0L' as DiodeReading)).toBe('open');
    expect(() => judgeDiode('abc' as DiodeReading, 'OL')).toThrow(expect.objectContaining({ code: 'unparseable', field: 'forward' }));
    expect(() => judgeDiode(-0.6, 'OL')).toThrow(expect.objectContaining({ code: 'negative' }));
    expect(() => judgeDiode(NaN, 'OL')).toThrow(expect.objectContaining({ code: 'not-a-number' }));
  });
});

/** Readings a meter gives on a bridge whose legs behave as described (anode → cathode per leg). */
function bridgeReadings(leg: Partial<Record<string, { forward: DiodeReading; reverse: DiodeReading }>> = {}): ProbeReading[] {
  const good = { forward: 0.55, reverse: 'OL' as DiodeReading };
  const legs: Array<[BridgeTerminal, BridgeTerminal, string]> = [
    ['AC1', '+', 'AC1→+'],
    ['AC2', '+', 'AC2→+'],
    ['-', 'AC1', '-→AC1'],
    ['-', 'AC2', '-→AC2'],
  ];
  const readings: ProbeReading[] = [];
  for (const [anode, cathode, name] of legs) {
    const r = leg[name] ?? good;
    readings.push({ red: anode, black: cathode, value: r.forward }, { red: cathode, black: anode, value: r.reverse });
  }
  return readings;
}

describe('judgeBridgeRectifier', () => {
  it('a good bridge: each leg one junction one way and OL the other; AC–AC open; − to + two junctions', () => {
    const readings = [
      ...bridgeReadings(),
      { red: 'AC1', black: 'AC2', value: 'OL' },
      { red: 'AC2', black: 'AC1', value: 'OL' },
      { red: '-', black: '+', value: 1.1 },
      { red: '+', black: '-', value: 'OL' },
    ] satisfies ProbeReading[];
    const result = judgeBridgeRectifier(readings);
    expect(result.verdict).toBe('good');
    expect(result.badLegs).toEqual([]);
    expect(result.checks.map((c) => c.ok)).toEqual([true, true]);
  });

  it('names the open leg', () => {
    const result = judgeBridgeRectifier(bridgeReadings({ 'AC2→+': { forward: 'OL', reverse: 'OL' } }));
    expect(result.verdict).toBe('bad');
    expect(result.badLegs).toEqual(['AC2→+']);
    expect(result.legs.find((l) => l.leg === 'AC2→+')?.verdict).toBe('open');
  });

  it('names a shorted leg, and the AC-to-AC cross-check then fails too', () => {
    const readings = [
      ...bridgeReadings({ '-→AC1': { forward: 0.02, reverse: 0.02 } }),
      { red: 'AC1', black: 'AC2', value: 0.55 },
    ] satisfies ProbeReading[];
    const result = judgeBridgeRectifier(readings);
    expect(result.badLegs).toEqual(['-→AC1']);
    expect(result.legs.find((l) => l.leg === '-→AC1')?.verdict).toBe('shorted');
    expect(result.checks).toEqual([expect.objectContaining({ name: 'AC1↔AC2', ok: false })]);
  });

  it('calls a bridge suspect when every leg passes but − to + is outside the two-junction range', () => {
    const result = judgeBridgeRectifier([...bridgeReadings(), { red: '-', black: '+', value: 0.3 }]);
    expect(result.verdict).toBe('suspect');
  });

  it('needs all eight leg readings and refuses contradictions', () => {
    const missing = bridgeReadings().slice(1);
    expect(() => judgeBridgeRectifier(missing)).toThrow(expect.objectContaining({ code: 'missing-input' }));
    const contradictory = [...bridgeReadings(), { red: 'AC1', black: '+', value: 0.7 }] satisfies ProbeReading[];
    expect(() => judgeBridgeRectifier(contradictory)).toThrow(expect.objectContaining({ code: 'conflicting-input' }));
    expect(() => judgeBridgeRectifier([{ red: 'AC1', black: 'AC1', value: 0.5 }])).toThrow(
      expect.objectContaining({ code: 'unknown-code' }),
    );
  });
});

describe('custom ranges', () => {
  it('takes a germanium-style range and refuses ranges that run backwards', () => {
    const germanium = {
      junctionMinVolts: 0.15,
      junctionMaxVolts: 0.35,
      shortedMaxVolts: 0.05,
      seriesPairMinVolts: 0.3,
      seriesPairMaxVolts: 0.7,
    };
    expect(judgeDiode(0.25, 'OL', germanium).verdict).toBe('good');
    expect(() => judgeDiode(0.25, 'OL', { ...germanium, junctionMinVolts: 0.5 })).toThrow(
      expect.objectContaining({ code: 'out-of-range' }),
    );
    expect(() => judgeDiode(0.25, 'OL', { ...germanium, shortedMaxVolts: -1 })).toThrow(expect.objectContaining({ code: 'negative' }));
  });
});
