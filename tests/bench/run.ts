/**
 * Runs every *.bench.ts file in this folder, one after another (npm run bench); names given after `--`
 * pick the files whose names contain them (npm run bench -- endpoints).
 */
import { readdirSync } from 'node:fs';

const here = new URL('.', import.meta.url);
const only = process.argv.slice(2);
const files = readdirSync(here)
  .filter((name) => name.endsWith('.bench.ts'))
  .filter((name) => only.length === 0 || only.some((part) => name.includes(part)))
  .sort();
for (const file of files) {
  console.log(`\n=== ${file} ===`);
  await import(new URL(file, here).href);
}
