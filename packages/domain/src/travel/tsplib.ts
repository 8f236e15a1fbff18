import { DomainError } from '../errors.ts';

/**
 * TSPLIB instance files (Reinelt, "TSPLIB — A Traveling Salesman Problem Library", ORSA Journal on Computing 3(4),
 * 1991; format in the TSPLIB95 documentation). Only the coordinate types the planner is checked on: EUC_2D, where
 * d(i, j) = nint(sqrt(dx² + dy²)) (TSPLIB95 §2.1), and CEIL_2D, which rounds up instead.
 */

export interface TsplibInstance {
  name: string;
  dimension: number;
  edgeWeightType: 'EUC_2D' | 'CEIL_2D';
  coordinates: Array<{ x: number; y: number }>;
}

function invalid(message: string): never {
  throw new DomainError('invalid-tsp', message, 'tsp');
}

export function parseTsplib(text: string): TsplibInstance {
  if (typeof text !== 'string') invalid('a TSPLIB file must be text');
  const lines = text.split(/\r?\n/);
  const header = new Map<string, string>();
  const coordinates: Array<{ x: number; y: number }> = [];
  let inCoordinates = false;
  for (const raw of lines) {
    const line = raw.trim();
    if (line === '' || line === 'EOF') {
      if (line === 'EOF') break;
      continue;
    }
    if (line === 'NODE_COORD_SECTION') {
      inCoordinates = true;
      continue;
    }
    if (inCoordinates) {
      const fields = line.split(/\s+/);
      if (fields.length !== 3) {
        if (/^[A-Z_]+\s*:?/.test(line) && !/^\d/.test(line)) {
          inCoordinates = false;
          if (line.endsWith('_SECTION')) invalid(`${line} is not supported`);
        } else invalid(`"${line}" is not "index x y"`);
      } else {
        const [index, x, y] = fields.map(Number) as [number, number, number];
        if (![index, x, y].every(Number.isFinite)) invalid(`"${line}" is not "index x y"`);
        if (index !== coordinates.length + 1) invalid(`node ${index} is out of order (expected ${coordinates.length + 1})`);
        coordinates.push({ x, y });
        continue;
      }
    }
    const colon = line.indexOf(':');
    if (colon < 0) {
      if (line.endsWith('_SECTION')) invalid(`${line} is not supported`);
      invalid(`"${line}" is not "KEY : VALUE"`);
    }
    header.set(line.slice(0, colon).trim().toUpperCase(), line.slice(colon + 1).trim());
  }

  const type = header.get('TYPE');
  if (type !== undefined && type !== 'TSP') invalid(`TYPE ${type} is not supported (only TSP)`);
  const weightType = header.get('EDGE_WEIGHT_TYPE');
  if (weightType !== 'EUC_2D' && weightType !== 'CEIL_2D')
    invalid(`EDGE_WEIGHT_TYPE ${weightType ?? '(missing)'} is not supported (EUC_2D, CEIL_2D)`);
  const dimension = Number(header.get('DIMENSION'));
  if (!Number.isInteger(dimension) || dimension < 1) invalid('DIMENSION must be a positive whole number');
  if (coordinates.length !== dimension) invalid(`DIMENSION is ${dimension} but ${coordinates.length} nodes were given`);
  return { name: header.get('NAME') ?? '', dimension, edgeWeightType: weightType, coordinates };
}

/** The instance's distance matrix, in TSPLIB's rounded metric. */
export function tsplibMatrix(instance: TsplibInstance): number[][] {
  const round = instance.edgeWeightType === 'EUC_2D' ? (d: number) => Math.floor(d + 0.5) : Math.ceil;
  return instance.coordinates.map((a) =>
    instance.coordinates.map((b) => {
      const dx = a.x - b.x;
      const dy = a.y - b.y;
      return round(Math.sqrt(dx * dx + dy * dy));
    }),
  );
}
