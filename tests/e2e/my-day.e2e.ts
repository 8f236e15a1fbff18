// The technician's phone without signal: My day is home, a stop's work order is marked done with time on site and a
// part used while offline, the changes survive a reload, and reach the office exactly once when the signal is back.
// And a conflict: the office moves the same work order meanwhile, and the phone asks the technician what to keep.
import { expect, test, type Browser, type Page } from '@playwright/test';
import type { RouteDay } from '@bumperline/contracts/route-days';
import type { MyVan } from '@bumperline/contracts/stock';
import type { WorkOrder } from '@bumperline/contracts/work-orders';
import type { PartsUsedList } from '@bumperline/contracts/parts-used';
import { demo, scan, signIn } from './fixtures.ts';

const PHONE = { width: 390, height: 844 };
const JSON_HEADERS = { 'X-Requested-With': 'bumperline', 'Content-Type': 'application/json' };

async function technicianPhone(browser: Browser): Promise<Page> {
  // The service worker serves the app shell offline (the config blocks it for the other suites).
  const context = await browser.newContext({ viewport: PHONE, serviceWorkers: 'allow' });
  const page = await context.newPage();
  await signIn(page, demo.technician);
  await expect(page).toHaveURL(/\/my-day$/);
  return page;
}

/** The day's open care-plan work with the stop it is at (on the route or not), from the API the screen reads. */
async function openWork(page: Page) {
  const day = (await (await page.request.get('/api/my-day')).json()) as RouteDay;
  const work = [...day.stops, ...day.unscheduled].flatMap((stop) =>
    stop.items.filter((i) => i.kind === 'work_order' && i.state === 'open').map((order) => ({ stop, order })),
  );
  expect(work.length, 'the demo technician has open care-plan work today').toBeGreaterThanOrEqual(2);
  return { day, work };
}

const myVan = async (page: Page) => (await (await page.request.get('/api/stock/my-van')).json()) as MyVan;

/** Waits until the phone has written its copy (saved shortly after each change). */
const letItSave = (page: Page) => page.waitForTimeout(800);

test('offline: done with time on site and a part used, kept over a reload, sent once when back online', async ({ browser }) => {
  test.setTimeout(120_000);
  const page = await technicianPhone(browser);
  const { day, work } = await openWork(page);

  // My day is home, the stops in driving order with their arrival times.
  const cards = page.getByRole('list', { name: 'Stops in driving order' }).locator(':scope > li');
  await expect(cards).toHaveCount(day.stops.length);
  for (const [i, s] of day.stops.entries()) {
    await expect(cards.nth(i)).toContainText(s.venue.name);
    await expect(cards.nth(i)).toContainText(s.arrival);
  }
  await expect(cards.first().getByRole('link', { name: /Navigate to/ })).toHaveAttribute('href', day.stops[0]!.mapsUrl);
  await scan(page, 'my-day-phone-light');

  // Open a stop with open work while online: the phone keeps what the stop needs.
  const { stop, order } = work[0]!;
  await page
    .locator('li[aria-label]', { hasText: stop.venue.name })
    .first()
    .getByRole('link', { name: /Open stop/ })
    .click();
  await expect(page.getByRole('heading', { level: 1, name: stop.venue.name })).toBeVisible();
  const card = page.locator(`[data-item-id="${order.id}"]`);
  await expect(card.getByRole('button', { name: 'Done' })).toBeVisible();
  const vanBefore = await myVan(page);
  const carried = vanBefore.levels.filter((l) => l.quantity >= 1);
  expect(carried.length, 'the van carries parts').toBeGreaterThan(0);
  await page.waitForLoadState('networkidle');
  await letItSave(page);

  // No signal from here.
  await page.context().setOffline(true);
  await expect(page.getByText(/Offline — showing the day as saved at \d\d:\d\d/)).toBeVisible();

  // The van's parts are offered from the phone's copy (no search needed, so no signal needed).
  const picker = card.getByRole('region', { name: /Parts used on/ });
  await picker.getByText(/Add a part used/).click();
  await picker
    .getByRole('button', { name: new RegExp(carried[0]!.partNumber) })
    .first()
    .click();
  await picker.getByRole('button', { name: `Add ${carried[0]!.partNumber}` }).click();
  await expect(picker.getByText(/not sent yet/)).toBeVisible();
  await card.getByLabel('Time on site').fill('45 min');
  await card.getByRole('button', { name: 'Done' }).click();
  await expect(page.getByRole('link', { name: '2 changes not sent yet — they go when there is signal' })).toBeVisible();
  await expect(card.getByText('Not sent yet')).toBeVisible();
  await scan(page, 'my-stop-phone-offline');
  await letItSave(page);

  // A reload without signal: the service worker serves the app, the phone's copy the day and the queue.
  await page.reload();
  await expect(page.getByRole('heading', { level: 1, name: stop.venue.name })).toBeVisible();
  await expect(page.getByText(/Offline — showing the day as saved at \d\d:\d\d/)).toBeVisible();
  await expect(page.getByRole('link', { name: /2 changes not sent yet/ })).toBeVisible();
  await page.getByRole('link', { name: /2 changes not sent yet/ }).click();
  await expect(page.getByText(`Done: ${order.title} (45 min) — ${stop.venue.name}`)).toBeVisible();
  await expect(page.getByText(/Queued \d\d:\d\d · waiting for signal/)).toHaveCount(2);
  await scan(page, 'my-changes-phone-offline');

  // Signal again: both go, in order, once.
  await page.context().setOffline(false);
  await expect(page.getByText('Everything has reached the office.')).toBeVisible({ timeout: 20_000 });
  const after = (await (await page.request.get(`/api/work-orders/${order.id}`)).json()) as WorkOrder;
  expect(after).toMatchObject({ state: 'done', labourMinutes: 45 });
  const used = (await (await page.request.get(`/api/work-orders/${order.id}/parts-used`)).json()) as PartsUsedList;
  expect(used.items.map((u) => [u.partNumber, u.quantity])).toEqual([[carried[0]!.partNumber, 1]]);
  const vanAfter = await myVan(page);
  const level = (v: MyVan) => v.levels.find((l) => l.cataloguePartId === carried[0]!.cataloguePartId)?.quantity ?? 0;
  expect(level(vanAfter)).toBe(level(vanBefore) - 1);
  await page.context().close();
});

test('conflict: the office moves the work order while the phone is offline; the phone shows both and sends again', async ({ browser }) => {
  test.setTimeout(120_000);
  const page = await technicianPhone(browser);
  const { work } = await openWork(page);
  const { stop, order } = work[work.length - 1]!;
  await page.goto(`/my-day/stops/${stop.venue.id}`);
  const card = page.locator(`[data-item-id="${order.id}"]`);
  await expect(card.getByRole('button', { name: 'Done' })).toBeVisible();
  await page.waitForLoadState('networkidle');

  await page.context().setOffline(true);
  await card.getByLabel('Time on site').fill('1 h 30');
  await card.getByRole('button', { name: 'Done' }).click();
  await expect(page.getByRole('link', { name: /1 change not sent yet/ })).toBeVisible();

  // Meanwhile the office moves it to tomorrow.
  const office = await browser.newContext();
  const officePage = await office.newPage();
  await signIn(officePage, demo.dispatcher);
  const current = (await (await officePage.request.get(`/api/work-orders/${order.id}`)).json()) as WorkOrder;
  const tomorrow = new Date(Date.parse(`${current.plannedOn ?? new Date().toISOString().slice(0, 10)}T12:00:00Z`) + 86_400_000)
    .toISOString()
    .slice(0, 10);
  const moved = await officePage.request.post(`/api/work-orders/${order.id}/move`, {
    headers: JSON_HEADERS,
    data: { version: current.version, plannedOn: tomorrow },
  });
  expect(moved.status()).toBe(200);
  await office.close();

  await page.context().setOffline(false);
  await expect(page.getByRole('link', { name: /1 change needs your decision/ })).toBeVisible({ timeout: 20_000 });
  await page.getByRole('link', { name: /1 change needs your decision/ }).click();
  await expect(page.getByText('The office changed this while you were working on it')).toBeVisible();
  const office_ = page.locator('div', { has: page.getByRole('heading', { name: 'The office has now' }) }).last();
  await expect(office_).toContainText(tomorrow);
  const mine = page.locator('div', { has: page.getByRole('heading', { name: 'You sent' }) }).last();
  await expect(mine).toContainText('1 h 30');
  await scan(page, 'my-changes-conflict');

  await page.getByRole('button', { name: 'Send mine again' }).click();
  await expect(page.getByText('Everything has reached the office.')).toBeVisible({ timeout: 20_000 });
  const after = (await (await page.request.get(`/api/work-orders/${order.id}`)).json()) as WorkOrder;
  expect(after).toMatchObject({ state: 'done', labourMinutes: 90, plannedOn: tomorrow });
  await page.context().close();
});

/** The copies the phone holds, by the id of the person they belong to. */
const savedCopies = (page: Page) =>
  page.evaluate(
    () =>
      new Promise<string[]>((resolve, reject) => {
        const open = indexedDB.open('bumperline-offline');
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const db = open.result;
          if (!db.objectStoreNames.contains('copies')) return resolve([]);
          const keys = db.transaction('copies').objectStore('copies').getAllKeys();
          keys.onsuccess = () => resolve(keys.result.map(String));
        };
      }),
  );

test("signing out deletes the phone's copy; the next person never gets the last one's day", async ({ browser }) => {
  const page = await technicianPhone(browser);
  await expect(page.getByRole('list', { name: 'Stops in driving order' })).toBeVisible();
  await page.waitForLoadState('networkidle');
  await letItSave(page);
  const me = (await (await page.request.get('/api/account/me')).json()) as { user: { id: string } };
  expect(await savedCopies(page)).toEqual([me.user.id]);

  await page.getByRole('navigation', { name: 'Main' }).getByRole('button', { name: 'More' }).click();
  await page.getByRole('dialog', { name: 'Menu' }).getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  expect(await savedCopies(page)).toEqual([]);
  expect(await page.evaluate(() => localStorage.getItem('bumperline-offline-owner'))).toBeNull();

  await signIn(page, demo.owner);
  await expect(page.getByRole('heading', { name: 'Today' })).toBeVisible();
  await page.waitForLoadState('networkidle');
  await letItSave(page);
  const owner = (await (await page.request.get('/api/account/me')).json()) as { user: { id: string } };
  expect(await savedCopies(page)).toEqual([owner.user.id]);
  await page.context().close();
});
