// A photo of the game taken at a stop without signal: it waits on the phone (kept over a reload, shown in the changes
// list) and reaches the office exactly once when the signal is back.
import { expect, test, type Browser, type Page } from '@playwright/test';
import sharp from 'sharp';
import type { CallDetail } from '@bumperline/contracts/calls';
import type { RouteDay } from '@bumperline/contracts/route-days';
import { demo, scan, signIn } from './fixtures.ts';

const PHONE = { width: 390, height: 844 };

async function technicianPhone(browser: Browser): Promise<Page> {
  // The service worker serves the app shell offline (the config blocks it for the other suites).
  const context = await browser.newContext({ viewport: PHONE, serviceWorkers: 'allow' });
  const page = await context.newPage();
  await signIn(page, demo.technician);
  await expect(page).toHaveURL(/\/my-day$/);
  return page;
}

const photosOf = async (page: Page, callId: string) =>
  ((await (await page.request.get(`/api/calls/${callId}`)).json()) as CallDetail).photos;

test('offline: a photo of the game is kept over a reload and arrives once when back online', async ({ browser }) => {
  test.setTimeout(120_000);
  const page = await technicianPhone(browser);
  const day = (await (await page.request.get('/api/my-day')).json()) as RouteDay;
  const calls = [...day.stops, ...day.unscheduled].flatMap((stop) =>
    stop.items.filter((i) => i.kind === 'service_call' && !['closed', 'cancelled'].includes(i.state)).map((call) => ({ stop, call })),
  );
  expect(calls.length, 'the demo technician has an open service call today').toBeGreaterThan(0);
  const { stop, call } = calls[0]!;
  const before = await photosOf(page, call.id);

  await page.goto(`/my-day/stops/${stop.venue.id}`);
  await expect(page.getByRole('heading', { level: 1, name: stop.venue.name })).toBeVisible();
  const card = page.locator(`[data-item-id="${call.id}"]`);
  await expect(card.getByText('Add a photo')).toBeVisible();
  await page.waitForLoadState('networkidle');
  await page.waitForTimeout(800); // the phone writes its copy shortly after

  // No signal from here.
  await page.context().setOffline(true);
  const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#c33' } })
    .jpeg()
    .toBuffer();
  await card.locator('input[type="file"]').setInputFiles({ name: 'game.jpg', mimeType: 'image/jpeg', buffer: jpeg });
  await expect(card.getByText('Photo added; it goes to the office when there is signal.')).toBeVisible();
  await expect(page.getByRole('link', { name: /1 change not sent yet/ })).toBeVisible();
  await scan(page, 'my-stop-photo-offline');
  await page.waitForTimeout(800);

  // A reload without signal: the change and its picture are still on the phone.
  await page.reload();
  await expect(page.getByRole('heading', { level: 1, name: stop.venue.name })).toBeVisible();
  await page.getByRole('link', { name: /1 change not sent yet/ }).click();
  await expect(page.getByText(`Photo: ${call.game.modelTitle} — ${stop.venue.name}`)).toBeVisible();
  await expect(page.getByText(/Queued \d\d:\d\d · waiting for signal/)).toHaveCount(1);
  await expect(page.getByRole('img', { name: 'The queued photo' })).toBeVisible();
  await scan(page, 'my-changes-photo-offline');

  // Signal again: it goes, once.
  await page.context().setOffline(false);
  await expect(page.getByText('Everything has reached the office.')).toBeVisible({ timeout: 20_000 });
  const after = await photosOf(page, call.id);
  expect(after).toHaveLength(before.length + 1);
  const added = after.filter((p) => !before.some((b) => b.id === p.id));
  expect(added).toEqual([expect.objectContaining({ uploadedBy: 'staff', width: 64, height: 48 })]);
  await page.context().close();
});
