import { describe, expect, it } from 'vitest';
import { fieldDomId, placeProblems, problemAt, stepOfField } from './field-problems.ts';

const steps = ['inspect', 'fuses', 'measure', 'parts'];

describe('placeProblems', () => {
  it('puts each problem at its field, counts them per step and picks the first in working order', () => {
    const placed = placeProblems(
      [
        { field: 'partsUsed.0.quantity', message: 'must be a whole number' },
        { field: 'steps.measure.readings.r12', message: '"abc" is not a value' },
        { field: 'steps.fuses.fuses.f1', message: 'F is quick-acting; the circuit needs T time-lag' },
        { field: 'steps.measure.readings.r14', message: 'a component value cannot be negative' },
      ],
      steps,
    );
    expect(placed.first?.field).toBe('steps.fuses.fuses.f1');
    expect(placed.countByStep).toEqual({ fuses: 1, measure: 2 });
    expect(placed.byField['steps.measure.readings.r12']).toBe('"abc" is not a value');
    expect(placed.byField['partsUsed.0.quantity']).toBe('Must be a whole number');
    expect(placed.unplaced).toEqual([]);
  });

  it('keeps problems naming no field here apart, and joins two messages on one field', () => {
    const placed = placeProblems(
      [
        { field: 'version', message: 'is out of date' },
        { field: 'steps.gone.done', message: 'unknown step' },
        { field: 'steps.inspect.acknowledged', message: 'read the cautions first.' },
        { field: 'steps.inspect.acknowledged', message: 'Tick it.' },
      ],
      steps,
    );
    expect(placed.unplaced.map((p) => p.field)).toEqual(['version', 'steps.gone.done']);
    expect(placed.byField['steps.inspect.acknowledged']).toBe('Read the cautions first. Tick it.');
    expect(placed.first?.field).toBe('steps.inspect.acknowledged');
  });

  it('has no first problem when there are none', () => {
    expect(placeProblems([], steps).first).toBeNull();
  });
});

describe('field helpers', () => {
  it('finds the step of a field', () => {
    expect(stepOfField('steps.measure-resistors.readings.abc')).toBe('measure-resistors');
    expect(stepOfField('steps.inspect')).toBe('inspect');
    expect(stepOfField('partsUsed.1.quantity')).toBeNull();
  });

  it('makes DOM ids that differ for fields that differ only in punctuation', () => {
    const a = fieldDomId('steps.bridge.diodes.d1.AC1→+');
    const b = fieldDomId('steps.bridge.diodes.d1.AC1→-');
    expect(a).toMatch(/^[A-Za-z0-9_-]+$/);
    expect(a).not.toBe(b);
  });

  it('finds a message under a part when the server named a leg', () => {
    const byField = { 'steps.bridge.diodes.br1.AC1→+': 'shorted' };
    expect(problemAt(byField, 'steps.bridge.diodes.br1')).toBe('shorted');
    expect(problemAt(byField, 'steps.bridge.diodes.br2')).toBeUndefined();
  });
});
