import { chromium } from '@playwright/test';
const base = 'http://127.0.0.1:3148';
const [, , who = 'tech1@lakeshore.example', ...paths] = process.argv;
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'] });
const ctx = await browser.newContext({ viewport: { width: 390, height: 844 } });
const page = await ctx.newPage();
page.on('pageerror', (e) => console.log('PAGEERROR', e.message));
page.on('console', (m) => m.type() === 'error' && console.log('CONSOLE', m.text()));
await page.goto(base + '/sign-in');
await page.getByLabel('E-mail').fill(who);
await page.getByLabel('Password').fill('bumperline-demo');
await page.getByRole('button', { name: 'Sign in' }).click();
await page.waitForTimeout(2500);
const day = await (await page.request.get(base + '/api/my-day')).json();
const wo = day.stops.find((s) => s.items.some((i) => i.kind === 'work_order'));
for (const p of paths) {
  let [path, theme, action] = p.split('|');
  if (path === 'STOP') path = '/my-day/stops/' + wo.venue.id;
  if (path === 'CALLSTOP') path = '/my-day/stops/' + day.stops.find((s) => s.items.some((i) => i.kind === 'service_call')).venue.id;
  if (theme) await page.evaluate((t) => localStorage.setItem('bumperline-theme', t), theme);
  await page.goto(base + path);
  await page.waitForLoadState('networkidle');
  if (action === 'more') await page.getByRole('button', { name: 'More' }).click();
  if (action?.startsWith('scroll')) await page.evaluate((y) => window.scrollTo(0, y), Number(action.slice(6)) || 700);
  const name = '/tmp/dshots/' + path.replace(/\W+/g, '_') + (theme ?? '') + (action ?? '') + '.png';
  await page.screenshot({ path: name });
  console.log(name);
}
await browser.close();
