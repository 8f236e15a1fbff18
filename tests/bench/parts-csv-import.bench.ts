/**
 * Parts-list CSV import and the live reading verdict — figures only, no timed assertions.
 *   npm run bench -- parts-csv        (BENCH_RUNS=7 runs, median)
 * Targets: 2,000 rows parsed (papaparse, as the web app and the API do), read and checked in under a second; one
 * reading judged far inside a frame (16 ms) so the verdict can follow each keystroke.
 */
import Papa from 'papaparse';
import { judgeReading } from '@bumperline/domain/components/bench-judgement';
import { rowsFromRecords } from '@bumperline/domain/components/parts-list-columns';
import { checkPartsList, readPartEntry } from '@bumperline/domain/components/parts-list-entry';
import { seededRandom } from '@bumperline/domain/travel/seeded-random';

const RUNS = Number(process.env.BENCH_RUNS ?? 7);
const ROWS = 2_000;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] ?? NaN;
}

/** A large invented board: resistors in RKM and colour bands, ceramics by code, electrolytics, fuses, semis. */
function partsCsv(rows: number, seed: number): string {
  const random = seededRandom(seed);
  const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)] as T;
  const resistors = ['4k7', '10k', '100R', 'R47', '2M2', '1k5', '330', '68k', '600'];
  const bands = ['brown black red gold', 'yellow violet red gold', 'red red orange silver', 'brown black black brown brown'];
  const ceramics = ['104', '103', '471', '4n7', '22pF', '100nF'];
  const electrolytics = ['4700µF', '100uF', '47µF', '2200µF', '10µF'];
  const fuses = ['T2.5A 250V', 'F1A 250V', 'T500mA', 'T3.15AL250V'];
  const semis: ReadonlyArray<[string, string, string]> = [
    ['D', 'diode', '1N4004'],
    ['BR', 'bridge_rectifier', 'KBPC3510'],
    ['Q', 'transistor', '2N3055'],
    ['U', 'regulator', 'LM7805'],
    ['J', 'connector', '0.156" header, 9 pin'],
  ];
  const lines = ['designator,kind,value,tolerance,rating,rated_temperature_c,rated_life_hours,notes'];
  for (let i = 1; i <= rows; i++) {
    const roll = random();
    if (roll < 0.4) {
      const banded = random() < 0.3;
      lines.push(
        `R${i},Resistor,${banded ? pick(bands) : pick(resistors)},${banded ? '' : pick(['5%', 'J', '±1 %'])},${pick(['1/4 W', '0.5W', '2 W', ''])},,,`,
      );
    } else if (roll < 0.6) {
      lines.push(`C${i},capacitor,${pick(ceramics)},${pick(['10%', 'K', '+80/-20%'])},${pick(['50 V', '100V', ''])},,,`);
    } else if (roll < 0.8) {
      lines.push(
        `C${i},Electrolytic capacitor,${pick(electrolytics)},20%,${pick(['16 V', '35 V', '63 V'])},${pick([85, 105])},${pick([1000, 2000, 5000])},"near the heatsink, replace with 105 °C"`,
      );
    } else if (roll < 0.85) {
      lines.push(`F${i},fuse,${pick(fuses)},,,,,`);
    } else {
      const [prefix, kind, value] = pick(semis);
      lines.push(`${prefix}${i},${kind},"${value.replace(/"/g, '""')}",,,,,`);
    }
  }
  return lines.join('\r\n');
}

function importOnce(csv: string): { rows: number; problems: number } {
  const parsed = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true });
  const { rows, problems } = rowsFromRecords(parsed.data);
  return { rows: rows.length, problems: problems.length + checkPartsList(rows).length };
}

const csv = partsCsv(ROWS, 7);
importOnce(csv); // warm up the JIT
const importTimes: number[] = [];
let outcome = importOnce(csv);
for (let run = 0; run < RUNS; run++) {
  const start = performance.now();
  outcome = importOnce(csv);
  importTimes.push(performance.now() - start);
}

// A live verdict: what the reading field does on each keystroke.
const spec = readPartEntry({
  designator: 'R7',
  kind: 'resistor',
  value: '600',
  tolerance: '10%',
  rating: '',
  ratedTemperatureC: null,
  ratedLifeHours: null,
});
const typed = ['5', '57', '570', '4.63k', '4k63', '570R', 'abc', '1M'];
const CALLS = 20_000;
const verdictTimes: number[] = [];
for (let run = 0; run < RUNS; run++) {
  const start = performance.now();
  for (let i = 0; i < CALLS; i++) judgeReading(spec, typed[i % typed.length] ?? '570', i % 2 === 0);
  verdictTimes.push(((performance.now() - start) * 1000) / CALLS);
}

console.log(`\nParts-list CSV import — ${ROWS.toLocaleString('en')} rows (${(csv.length / 1024).toFixed(0)} KiB), median of ${RUNS} runs`);
console.table([
  {
    step: 'papaparse + rowsFromRecords + checkPartsList',
    rows: outcome.rows,
    problems: outcome.problems,
    time: `${median(importTimes).toFixed(1)} ms`,
    target: '< 1000 ms',
  },
]);
console.log(`\nLive reading verdict — judgeReading, ${CALLS.toLocaleString('en')} calls per run, median of ${RUNS} runs`);
console.table([{ per_call: `${median(verdictTimes).toFixed(2)} µs`, frame: '16 ms = 16,000 µs' }]);
