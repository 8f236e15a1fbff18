/**
 * Runs every *.bench.ts file in this folder, one after another (npm run bench).
 */
import { readdirSync } from 'node:fs';

const here = new URL('.', import.meta.url);
const files = readdirSync(here)
  .filter((name) => name.endsWith('.bench.ts'))
  .sort();
for (const file of files) {
  console.log(`\n=== ${file} ===`);
  await import(new URL(file, here).href);
}
