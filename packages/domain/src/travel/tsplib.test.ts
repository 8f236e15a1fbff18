import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseTsplib, tsplibMatrix } from './tsplib.ts';

const berlin52 = readFileSync(new URL('../../test-data/berlin52.tsp', import.meta.url), 'utf8');

describe('parseTsplib (TSPLIB95 format)', () => {
  it('reads berlin52: 52 EUC_2D nodes', () => {
    const instance = parseTsplib(berlin52);
    expect(instance).toMatchObject({ name: 'berlin52', dimension: 52, edgeWeightType: 'EUC_2D' });
    expect(instance.coordinates[0]).toEqual({ x: 565, y: 575 });
    expect(instance.coordinates[51]).toEqual({ x: 1740, y: 245 });
  });

  it('EUC_2D distances are nint(sqrt(dx² + dy²)) (TSPLIB95 §2.1; worked by hand)', () => {
    const m = tsplibMatrix(parseTsplib(berlin52));
    // Nodes 1 (565, 575) and 2 (25, 185): √(540² + 390²) = √443700 = 666.108… → 666.
    expect(m[0]?.[1]).toBe(666);
    expect(m[1]?.[0]).toBe(666);
    expect(m[5]?.[5]).toBe(0);
  });

  it('rounds half up and CEIL_2D rounds up', () => {
    const file = (type: string) => `NAME: t\nTYPE: TSP\nDIMENSION: 2\nEDGE_WEIGHT_TYPE: ${type}\nNODE_COORD_SECTION\n1 0 0\n2 1 1\nEOF\n`;
    expect(tsplibMatrix(parseTsplib(file('EUC_2D')))[0]?.[1]).toBe(1); // √2 = 1.414 → 1
    expect(tsplibMatrix(parseTsplib(file('CEIL_2D')))[0]?.[1]).toBe(2);
  });

  it.each([
    ['NAME: t\nTYPE: TSP\nDIMENSION: 3\nEDGE_WEIGHT_TYPE: EUC_2D\nNODE_COORD_SECTION\n1 0 0\n2 1 1\nEOF', /DIMENSION is 3/],
    ['NAME: t\nTYPE: TSP\nDIMENSION: 1\nEDGE_WEIGHT_TYPE: GEO\nNODE_COORD_SECTION\n1 0 0\nEOF', /GEO is not supported/],
    ['NAME: t\nTYPE: ATSP\nDIMENSION: 1\nEDGE_WEIGHT_TYPE: EUC_2D\nNODE_COORD_SECTION\n1 0 0\nEOF', /ATSP/],
    ['NAME: t\nTYPE: TSP\nDIMENSION: 1\nEDGE_WEIGHT_TYPE: EUC_2D\nNODE_COORD_SECTION\n1 0 zero\nEOF', /index x y/],
    ['NAME: t\nTYPE: TSP\nDIMENSION: 2\nEDGE_WEIGHT_TYPE: EUC_2D\nNODE_COORD_SECTION\n2 0 0\n1 0 0\nEOF', /out of order/],
  ])('refuses a broken file (%#)', (text, message) => {
    expect(() => parseTsplib(text)).toThrow(expect.objectContaining({ code: 'invalid-tsp', message: expect.stringMatching(message) }));
  });
});
