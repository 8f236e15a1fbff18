// The care-to-route story across roles: a dispatcher writes a care plan in plain words; the care-plan run (clock moved
// on) makes its work order; it lands on a technician's route day in planned order beside a service call at another
// venue; the dispatcher drags the second stop first and the technician's phone shows the new order; without signal the
// technician marks the work done with a part from the van, reloads, sees what is not sent, and when the signal is back
// it arrives once — the van's stock went down by one and the game's page shows the work. Phone screens at 390 × 844.
import { expect, test, type Browser, type Page } from '@playwright/test';
import type { RouteDay, RouteDayBoard } from '@bumperline/contracts/route-days';
import type { MyVan } from '@bumperline/contracts/stock';
import type { WorkOrder, WorkOrderPage } from '@bumperline/contracts/work-orders';
import type { PartsUsedList } from '@bumperline/contracts/parts-used';
import { DEMO_PASSWORD, dragStop, failOnConsoleErrors, scan, signIn } from './fixtures.ts';

const PHONE = { width: 390, height: 844 };
const JSON_HEADERS = { 'X-Requested-With': 'bumperline', 'Content-Type': 'application/json' };
const DISPATCHER = 'dispatch@lakeshore.example';
const TECHNICIAN = 'tech3@lakeshore.example';

/** The company's today (the demo company is in Chicago), as a date field takes it. */
const chicagoDate = (at = new Date()) => new Intl.DateTimeFormat('en-CA', { timeZone: 'America/Chicago' }).format(at);
const dayAfter = (day: string) => new Date(Date.parse(`${day}T12:00:00Z`) + 86_400_000).toISOString().slice(0, 10);

async function json<T>(page: Page, url: string): Promise<T> {
  const res = await page.request.get(url);
  expect(res.ok(), `GET ${url}`).toBe(true);
  return (await res.json()) as T;
}

const board = (page: Page) => json<RouteDayBoard>(page, '/api/route-days');

async function technicianPhone(browser: Browser): Promise<Page> {
  // The service worker serves the app shell offline (the config blocks it for the other suites).
  const context = await browser.newContext({ viewport: PHONE, serviceWorkers: 'allow' });
  const page = await context.newPage();
  await signIn(page, TECHNICIAN, DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/my-day$/);
  return page;
}

test('a care plan’s work reaches the technician’s route day, is reordered by the office, and is done offline once', async ({
  page,
  browser,
}) => {
  test.setTimeout(180_000);
  const consoleClean = failOnConsoleErrors(page);
  await page.setViewportSize({ width: 1400, height: 1000 });
  await signIn(page, DISPATCHER);
  const today = chicagoDate();

  // Arrange: the technician's day today starts empty (the office moves what the demo planned to tomorrow), and two
  // venues open today and on their route are chosen, one for the care plan's game and one for a service call.
  const before = await board(page);
  const theirs = before.days.find((d) => d.technician.name === 'Parveen Lutz')!;
  expect(theirs, 'the demo technician has a route day').toBeTruthy();
  const technicianId = theirs.technician.id;
  const [first, second] = theirs.stops;
  expect(second, 'the demo route has two venues open today').toBeTruthy();
  for (const stop of [...theirs.stops, ...theirs.unscheduled]) {
    const now = await json<RouteDay>(page, `/api/route-days/${technicianId}/${today}`);
    const moved = await page.request.post(`/api/route-days/${technicianId}/${today}/stops/${stop.venue.id}/move`, {
      headers: JSON_HEADERS,
      data: { toTechnicianId: technicianId, toDay: dayAfter(today), version: now.version },
    });
    expect(moved.ok(), `move ${stop.venue.name} to tomorrow`).toBe(true);
  }
  expect((await json<RouteDay>(page, `/api/route-days/${technicianId}/${today}`)).stops).toEqual([]);
  const gameAt = async (venueId: string) =>
    (await json<{ items: { id: string; serial: string; status: string }[] }>(page, `/api/games?venueId=${venueId}&limit=20`)).items.find(
      (g) => g.status === 'running',
    )!;
  const planGame = await gameAt(first!.venue.id);
  const callGame = await gameAt(second!.venue.id);
  expect(planGame && callGame, 'a running game at each venue').toBeTruthy();

  // 1. The dispatcher writes the care plan in plain words: every day at 23:30, from today, for that one game.
  const name = `Coin door and glass check ${Date.now().toString(36)}`;
  await page.goto('/care-plans/new');
  await page.getByLabel('Name', { exact: true }).fill(name);
  await page.getByLabel('One game', { exact: true }).check();
  await page.getByLabel('Find the game', { exact: true }).fill(planGame.serial);
  const gameSelect = page.getByLabel('Game', { exact: true });
  await expect(gameSelect.locator(`option[value="${planGame.id}"]`)).toBeAttached();
  await gameSelect.selectOption(planGame.id);
  await page.getByLabel('Task 1', { exact: true }).fill('Wipe the glass and check the coin door lock');
  await page.getByLabel('Time on site', { exact: true }).fill('30 min');
  await page.getByLabel('Starting on', { exact: true }).fill(today);
  await page.getByLabel('At', { exact: true }).fill('23:30');
  await page.getByLabel('Unit', { exact: true }).selectOption('day');
  await expect(page.getByText(/^Every day at 23:30$|^Every day at 11:30/)).toBeVisible();
  await page.getByLabel('Usual technician', { exact: true }).selectOption(technicianId);
  await page.getByRole('button', { name: 'Save care plan' }).click();
  await expect(page.getByRole('heading', { level: 1, name })).toBeVisible();

  // 2. The clock moves on: the care-plan run, as of a few minutes from now, makes the work order.
  await page.goto('/dev/care-plans');
  await page.getByLabel('Run as of (UTC)', { exact: true }).fill(new Date(Date.now() + 5 * 60_000).toISOString().slice(0, 16));
  await page.getByRole('button', { name: 'Run the care-plan run' }).click();
  await expect(page.getByRole('status')).toContainText('work orders created');
  const orders = await json<WorkOrderPage>(page, `/api/work-orders?q=${encodeURIComponent(name)}`);
  expect(orders.items).toHaveLength(1);
  const order = orders.items[0]!;
  expect(order).toMatchObject({ state: 'open', plannedOn: today, technician: { id: technicianId } });

  // A service call at the other venue, assigned to the same technician: it is on their today too.
  const opened = await page.request.post('/api/calls', {
    headers: JSON_HEADERS,
    data: { gameId: callGame.id, problem: 'no_credit', severity: 'fault', note: 'Takes coins, gives no credit' },
  });
  expect(opened.ok()).toBe(true);
  const call = (await opened.json()) as { id: string; version: number };
  const assigned = await page.request.post(`/api/calls/${call.id}/assign`, {
    headers: JSON_HEADERS,
    data: { technicianId, version: call.version },
  });
  expect(assigned.ok()).toBe(true);

  // 3. The route day: both stops, in the planner's order.
  await page.goto('/route-days');
  const column = page.locator(`[data-technician-id="${technicianId}"]`);
  await expect(column.getByTestId('route-stop')).toHaveCount(2);
  await expect(column.getByTestId('order-kind')).toHaveText('Planner’s order');
  const venueOrder = () => column.getByTestId('route-stop').evaluateAll((els) => els.map((el) => el.getAttribute('data-venue-id')));
  const planned = await venueOrder();
  expect([...planned].sort()).toEqual([first!.venue.id, second!.venue.id].sort());
  await scan(page, 'story-route-day-planned');

  // 4. The dispatcher drags the second stop first: the order is kept and the times re-planned.
  await dragStop(page, column.getByTestId('route-stop').nth(1), column.getByTestId('route-stop').nth(0));
  await expect(column.getByTestId('order-kind')).toHaveText('Order kept by the office');
  await expect.poll(venueOrder).toEqual([planned[1], planned[0]]);

  // 5. The technician's phone shows the new order.
  const phone = await technicianPhone(browser);
  const cards = phone.getByRole('list', { name: 'Stops in driving order' }).locator(':scope > li');
  await expect(cards).toHaveCount(2);
  const venueName = (id: string | null) => [first!, second!].find((s) => s.venue.id === id)!.venue.name;
  await expect(cards.nth(0)).toContainText(venueName(planned[1]!));
  await expect(cards.nth(1)).toContainText(venueName(planned[0]!));
  await scan(phone, 'story-my-day-reordered');

  // 6. At the care plan's stop, with the van's stock known, the signal goes.
  await phone.goto(`/my-day/stops/${first!.venue.id}`);
  await expect(phone.getByRole('heading', { level: 1, name: first!.venue.name })).toBeVisible();
  const card = phone.locator(`[data-item-id="${order.id}"]`);
  await expect(card.getByRole('button', { name: 'Done' })).toBeVisible();
  const vanBefore = await json<MyVan>(phone, '/api/stock/my-van');
  const carried = vanBefore.levels.find((l) => l.quantity >= 1);
  expect(carried, 'the van carries parts').toBeTruthy();
  await phone.waitForLoadState('networkidle');
  await phone.waitForTimeout(800); // the phone saves its copy shortly after each change
  await phone.context().setOffline(true);
  await expect(phone.getByText(/Offline — showing the day as saved at \d\d:\d\d/)).toBeVisible();

  const picker = card.getByRole('region', { name: /Parts used on/ });
  await picker.getByText(/Add a part used/).click();
  await picker
    .getByRole('button', { name: new RegExp(carried!.partNumber) })
    .first()
    .click();
  await picker.getByRole('button', { name: `Add ${carried!.partNumber}` }).click();
  await card.getByLabel('Time on site').fill('30 min');
  await card.getByRole('button', { name: 'Done' }).click();
  await expect(phone.getByRole('link', { name: /2 changes not sent yet/ })).toBeVisible();
  await phone.waitForTimeout(800);

  // 7. A reload without signal: the changes are still there, and listed.
  await phone.reload();
  await expect(phone.getByRole('heading', { level: 1, name: first!.venue.name })).toBeVisible();
  await phone.getByRole('link', { name: /2 changes not sent yet/ }).click();
  await expect(phone.getByText(`Done: ${order.title} (30 min) — ${first!.venue.name}`)).toBeVisible();
  await scan(phone, 'story-changes-offline');

  // 8. Signal again: they arrive, once.
  await phone.context().setOffline(false);
  await expect(phone.getByText('Everything has reached the office.')).toBeVisible({ timeout: 30_000 });
  const done = await json<WorkOrder>(page, `/api/work-orders/${order.id}`);
  expect(done).toMatchObject({ state: 'done', labourMinutes: 30 });
  const used = await json<PartsUsedList>(page, `/api/work-orders/${order.id}/parts-used`);
  expect(used.items.map((u) => [u.partNumber, u.quantity])).toEqual([[carried!.partNumber, 1]]);
  const vanAfter = await json<MyVan>(phone, '/api/stock/my-van');
  const level = (v: MyVan) => v.levels.find((l) => l.cataloguePartId === carried!.cataloguePartId)?.quantity ?? 0;
  expect(level(vanAfter)).toBe(level(vanBefore) - 1);
  await phone.context().close();

  // 9. The game's page shows the work done.
  await page.goto(`/games/${planGame.id}`);
  const section = page.locator('section', { has: page.getByRole('heading', { name: 'Care-plan work' }) });
  await expect(section.getByRole('link', { name })).toBeVisible();
  await expect(section.getByText('Done', { exact: true }).first()).toBeVisible();
  await scan(page, 'story-game-history');
  consoleClean();
});
