// What the built product serves: the app's bundles without their source maps. Maps are made for reading
// error reports, but they live outside the served folder and no served file points at them.
import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { expect, test } from '@playwright/test';

const dist = path.resolve(import.meta.dirname, '../../dist');

test('the served folder holds no source maps, and asking for one finds nothing', async ({ request }) => {
  const served = readdirSync(path.join(dist, 'web/assets'));
  expect(served.some((f) => f.endsWith('.js'))).toBe(true);
  expect(served.filter((f) => f.endsWith('.map'))).toEqual([]);
  // The maps exist, beside the served folder, for whoever reads error reports.
  expect(existsSync(path.join(dist, 'sourcemaps/assets'))).toBe(true);
  expect(readdirSync(path.join(dist, 'sourcemaps/assets')).some((f) => f.endsWith('.js.map'))).toBe(true);

  const shell = await (await request.get('/')).text();
  const script = /<script[^>]+src="(\/assets\/[^"]+\.js)"/.exec(shell)?.[1];
  expect(script).toBeTruthy();
  const js = await request.get(script!);
  expect(js.status()).toBe(200);
  expect(await js.text()).not.toContain('sourceMappingURL');
  expect((await request.get(`${script}.map`)).status()).toBe(404);
});

test('bundles go out compressed and are kept for good; the app shell is checked each time', async ({ request }) => {
  const shell = await request.get('/', { headers: { 'Accept-Encoding': 'gzip' } });
  expect(shell.headers()['cache-control']).toBe('no-cache');
  const script = /<script[^>]+src="(\/assets\/[^"]+\.js)"/.exec(await shell.text())?.[1];
  const js = await request.get(script!, { headers: { 'Accept-Encoding': 'gzip' } });
  expect(js.headers()['content-encoding']).toBe('gzip');
  expect(js.headers()['cache-control']).toMatch(/immutable/);
  expect(js.headers()['cache-control']).toMatch(/max-age=31536000/);
});
