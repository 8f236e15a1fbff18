import { describe, expect, it } from 'vitest';
import { readPartsCsv } from './csv-import.ts';

const HEADER = 'designator,kind,value,tolerance,rating,rated_temperature_c,rated_life_hours,notes';

describe('reading a parts list from a CSV file', () => {
  it('reads a clean file, as our export writes it (byte-order mark, neutralised formula cells)', () => {
    const file = [
      `\ufeff${HEADER}`,
      'F1,fuse,T2.5A 250V,,,,,mains primary',
      "C1,Electrolytic capacitor,15000µF,'+80/-20%,25 V,85,2000,",
      "R1,resistor,600,±10 %,5 W,,,'=bleeder",
      '',
    ].join('\r\n');
    const read = readPartsCsv(file);
    expect(read.problems).toEqual([]);
    expect(read.rows).toEqual([
      {
        designator: 'F1',
        kind: 'fuse',
        value: 'T2.5A 250V',
        tolerance: '',
        rating: '',
        ratedTemperatureC: null,
        ratedLifeHours: null,
        notes: 'mains primary',
      },
      {
        designator: 'C1',
        kind: 'electrolytic',
        value: '15000µF',
        tolerance: '+80/-20%',
        rating: '25 V',
        ratedTemperatureC: 85,
        ratedLifeHours: 2000,
        notes: '',
      },
      {
        designator: 'R1',
        kind: 'resistor',
        value: '600',
        tolerance: '±10 %',
        rating: '5 W',
        ratedTemperatureC: null,
        ratedLifeHours: null,
        notes: '=bleeder',
      },
    ]);
  });

  it('lists every row’s problems, with the designator, and brings in no rows while there are any', () => {
    const file = [
      HEADER,
      'R1,resistor,100µF,5%,1/4 W,,,',
      'R2,resistor,4k7,150%,1/4 W,,,',
      'r1,resistor,1k,5%,,,,',
      'C4,electrolytic,470µF,20%,35 V,warm,2000,',
      'Q1,transistor,TIP102,,,,',
    ].join('\n');
    const read = readPartsCsv(file);
    expect(read.problems.map((p) => [p.row, p.designator, p.field])).toEqual([
      [1, 'R1', 'value'],
      [2, 'R2', 'tolerance'],
      [3, 'r1', 'designator'],
      [4, 'C4', 'ratedTemperatureC'],
      [5, 'Q1', 'row'],
    ]);
    expect(read.problems[4]!.message).toMatch(/different number of cells than the header/);
  });

  it('refuses a file without the columns, naming the missing ones', () => {
    const read = readPartsCsv('designator,value\nR1,4k7\n');
    expect(read.rows).toEqual([]);
    expect(read.problems).toEqual([
      { row: 0, designator: '', field: 'columns', message: expect.stringMatching(/^missing columns kind, tolerance, rating/) },
    ]);
  });

  it('refuses more rows than a parts list holds', () => {
    const file = [HEADER, 'R1,resistor,1k,5%,,,,', 'R2,resistor,1k,5%,,,,', 'R3,resistor,1k,5%,,,,'].join('\n');
    expect(readPartsCsv(file, 2).problems).toEqual([
      { row: 0, designator: '', field: 'rows', message: 'the file has 3 parts; a parts list holds at most 2' },
    ]);
  });
});
