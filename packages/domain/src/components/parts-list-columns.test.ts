import { describe, expect, it } from 'vitest';
import { PARTS_LIST_COLUMNS, recordsFromRows, rowsFromRecords } from './parts-list-columns.ts';
import { checkPartsList } from './parts-list-entry.ts';

// Records as papaparse gives them with `header: true` (papaparse documentation, "Header row"): one object per line,
// keyed by the header's cells, every cell a string.
const header = {
  designator: '',
  kind: '',
  value: '',
  tolerance: '',
  rating: '',
  rated_temperature_c: '',
  rated_life_hours: '',
  notes: '',
};

describe('rowsFromRecords', () => {
  it('reads a header in the documented order, a kind by its label, and number cells', () => {
    expect(PARTS_LIST_COLUMNS).toEqual([
      'designator',
      'kind',
      'value',
      'tolerance',
      'rating',
      'rated_temperature_c',
      'rated_life_hours',
      'notes',
    ]);
    const { rows, problems } = rowsFromRecords([
      {
        ...header,
        designator: 'C12',
        kind: 'Electrolytic capacitor',
        value: '4700µF',
        tolerance: '20%',
        rating: '35 V',
        rated_temperature_c: '105 °C',
        rated_life_hours: '2,000 h',
      },
      { ...header, designator: 'R1', kind: 'resistor', value: '4k7', tolerance: 'J', notes: ' near the heatsink ' },
    ]);
    expect(problems).toEqual([]);
    expect(rows[0]).toEqual({
      designator: 'C12',
      kind: 'electrolytic',
      value: '4700µF',
      tolerance: '20%',
      rating: '35 V',
      ratedTemperatureC: 105,
      ratedLifeHours: 2000,
      notes: '',
    });
    expect(rows[1]).toMatchObject({ kind: 'resistor', ratedTemperatureC: null, ratedLifeHours: null, notes: 'near the heatsink' });
    expect(checkPartsList(rows)).toEqual([]);
  });

  it('names each missing column and returns no rows', () => {
    const { rows, problems } = rowsFromRecords([{ designator: 'R1', value: '1k', tolerance: '5%', rating: '' }]);
    expect(rows).toEqual([]);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ row: 0, field: 'columns' });
    expect(problems[0]?.message).toMatch(/^missing columns kind, rated_temperature_c, rated_life_hours /);
  });

  it('says "missing column kind" when only the kind is missing, and lets notes be left out', () => {
    const { kind: _kind, notes: _notes, ...withoutKind } = header;
    expect(rowsFromRecords([{ ...withoutKind, designator: 'R1' }]).problems[0]?.message).toMatch(/^missing column kind /);
    const { notes: _n, ...withoutNotes } = header;
    expect(rowsFromRecords([{ ...withoutNotes, designator: 'R1', kind: 'resistor', value: '1k', tolerance: '5%' }]).problems).toEqual([]);
  });

  it('matches headers written by people: "Reference", "Rated temperature (°C)", "Rated-Life-Hours"', () => {
    const { rows, problems } = rowsFromRecords([
      {
        Reference: 'C1',
        Kind: 'electrolytic',
        Value: '100µF',
        Tolerance: '20%',
        Rating: '16 V',
        'Rated temperature (°C)': '85',
        'Rated-Life-Hours': '1000',
        Notes: '',
      },
    ]);
    expect(problems).toEqual([]);
    expect(rows[0]).toMatchObject({ designator: 'C1', ratedTemperatureC: 85, ratedLifeHours: 1000 });
  });

  it('reports an unreadable number cell on its row and skips blank lines', () => {
    const { rows, problems } = rowsFromRecords([
      {
        ...header,
        designator: 'C1',
        kind: 'electrolytic',
        value: '100µF',
        tolerance: '20%',
        rated_temperature_c: 'hot',
        rated_life_hours: '1000',
      },
      { ...header },
      {
        ...header,
        designator: 'C2',
        kind: 'electrolytic',
        value: '100µF',
        tolerance: '20%',
        rated_temperature_c: '105',
        rated_life_hours: 'long',
      },
    ]);
    expect(rows).toHaveLength(2);
    expect(problems).toEqual([
      { row: 0, field: 'ratedTemperatureC', message: '“hot” is not a temperature: write the °C printed on the sleeve, e.g. 105' },
      { row: 1, field: 'ratedLifeHours', message: '“long” is not a number of hours: write the rated life, e.g. 2000' },
    ]);
  });

  it('round-trips through recordsFromRows', () => {
    const records = [{ ...header, designator: 'R1', kind: 'resistor', value: '4k7', tolerance: 'J', rating: '1/4 W', notes: 'x' }];
    expect(recordsFromRows(rowsFromRecords(records).rows)).toEqual(records);
  });
});
