// Route days for the office: every technician's day side by side with the map; the dispatcher drags a stop within
// a column (the order is kept and the times re-planned), goes back to the planner's order, and drags a stop onto
// another technician's column — each screen scanned with axe and kept as a screenshot.
import { expect, test, type Locator, type Page } from '@playwright/test';
import type { RouteDayBoard } from '@bumperline/contracts/route-days';
import { demo, dragStop, failOnConsoleErrors, scan, signIn } from './fixtures.ts';

const HEADERS = { 'X-Requested-With': 'bumperline', 'Content-Type': 'application/json' };

interface CallRow {
  id: string;
  venueId: string | null;
  state: string;
  version: number;
}

async function board(page: Page): Promise<RouteDayBoard> {
  const res = await page.request.get('/api/route-days');
  expect(res.ok()).toBe(true);
  return (await res.json()) as RouteDayBoard;
}

/** Gives the first technician open calls at three venues not yet on their day, so the day has stops to drag. */
async function arrangeStops(page: Page, technicianId: string) {
  const res = await page.request.get('/api/calls?state=open&limit=200');
  expect(res.ok()).toBe(true);
  const calls = ((await res.json()) as { items: CallRow[] }).items;
  const venues = new Set<string>();
  for (const call of calls) {
    if (venues.size >= 3) break;
    if (!call.venueId || venues.has(call.venueId) || !['reported', 'assigned'].includes(call.state)) continue;
    const assigned = await page.request.post(`/api/calls/${call.id}/assign`, {
      headers: HEADERS,
      data: { technicianId, version: call.version },
    });
    if (assigned.ok()) venues.add(call.venueId);
  }
}

const venueOrder = (column: Locator) =>
  column.getByTestId('route-stop').evaluateAll((els) => els.map((el) => el.getAttribute('data-venue-id')));

test('dispatcher reorders a technician’s stops by dragging, the times re-plan, and a stop moves to another technician', async ({
  page,
}) => {
  const check = failOnConsoleErrors(page);
  await page.setViewportSize({ width: 1400, height: 1000 });
  await signIn(page, demo.dispatcher);
  const before = await board(page);
  expect(before.days.length).toBeGreaterThanOrEqual(2);
  const [first, second] = before.days as [RouteDayBoard['days'][number], RouteDayBoard['days'][number]];
  if (first.stops.length < 2) await arrangeStops(page, first.technician.id);
  const arranged = (await board(page)).days[0]!;
  expect(arranged.stops.length, 'the first technician needs two stops to reorder').toBeGreaterThanOrEqual(2);

  await page.goto('/route-days');
  await expect(page.getByRole('heading', { name: 'Route days', level: 1 })).toBeVisible();
  const column = page.locator(`[data-technician-id="${first.technician.id}"]`);
  await expect(column.getByTestId('route-stop')).toHaveCount(arranged.stops.length);
  await expect(page.getByRole('figure', { name: /Map of every technician’s route/ })).toBeVisible();
  await scan(page, 'route-days');

  // Drag the second stop above the first: the order is kept, and the first stop's times are now the other venue's.
  const order = await venueOrder(column);
  const timesBefore = await column.getByTestId('stop-times').allTextContents();
  await dragStop(page, column.getByTestId('route-stop').nth(1), column.getByTestId('route-stop').nth(0));
  await expect(page.getByText('order is kept and the times re-planned')).toBeVisible();
  await expect(column.getByTestId('order-kind')).toHaveText('Order kept by the office');
  // (A stop the kept order can no longer reach inside its opening hours moves to "Could not be fitted".)
  await expect.poll(async () => (await venueOrder(column))[0]).toBe(order[1]);
  const kept = (await board(page)).days.find((d) => d.technician.id === first.technician.id)!;
  expect(kept.orderKind).toBe('kept');
  // The cards show the server's re-planned times for the new order, not the old times moved about.
  const replanned = kept.stops.map((s) => `${s.serviceStart}–${s.departure}`);
  await expect.poll(async () => (await column.getByTestId('stop-times').allTextContents()).map((t) => t.slice(0, 11))).toEqual(replanned);
  expect(replanned).not.toEqual(timesBefore.map((t) => t.slice(0, 11)));
  const keptOrder = [...kept.stops, ...kept.unscheduled].map((s) => s.venue.id);
  expect(keptOrder.slice(0, 1)).toEqual([order[1]]);
  expect(keptOrder).toContain(order[0]);
  await scan(page, 'route-days-kept-order');

  // Back to the planner's order.
  await column.getByRole('button', { name: 'Use the planner’s order' }).click();
  await expect(column.getByTestId('order-kind')).toHaveText('Planner’s order');

  // The same by keyboard: space lifts the second stop, the up arrow moves it, space drops it.
  const planned = await venueOrder(column);
  const keyHandle = column
    .getByTestId('route-stop')
    .nth(1)
    .getByRole('button', { name: /^Drag / });
  await expect(keyHandle).toBeEnabled();
  await keyHandle.focus();
  // A beat between keys, as a person gives: the lifted card is measured before it can move.
  for (const key of ['Space', 'ArrowUp', 'Space']) {
    await page.keyboard.press(key);
    await page.waitForTimeout(250);
  }
  await expect(column.getByTestId('order-kind')).toHaveText('Order kept by the office');
  await expect.poll(async () => (await venueOrder(column))[0]).toBe(planned[1]);
  await column.getByRole('button', { name: 'Use the planner’s order' }).click();
  await expect(column.getByTestId('order-kind')).toHaveText('Planner’s order');

  // Drag the first stop onto the second technician's column: it is theirs now, with every item of it (on their
  // route, or under "Could not be fitted" with the reason when their day is full).
  const moving = (await venueOrder(column))[0]!;
  const other = page.locator(`[data-technician-id="${second.technician.id}"]`);
  await dragStop(page, column.getByTestId('route-stop').first(), other.getByRole('list').first());
  await expect(page.getByText(/moved to/)).toBeVisible();
  await expect(other.locator(`[data-venue-id="${moving}"]`)).toBeVisible();
  await expect(column.locator(`[data-venue-id="${moving}"]`)).toHaveCount(0);
  const after = await board(page);
  // On their route, or listed under "Could not be fitted" with the reason when their day is already full.
  const theirs = after.days.find((d) => d.technician.id === second.technician.id)!;
  expect([...theirs.stops, ...theirs.unscheduled].map((s) => s.venue.id)).toContain(moving);
  await scan(page, 'route-days-moved');
  check();
});
