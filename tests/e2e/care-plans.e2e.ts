// Care plans in the browser: a dispatcher makes a "last Tuesday of the month" plan in plain words (never rule text),
// sees the next dates as they choose, is told at once when a schedule never falls on a date, and saves it; the
// demo's care-plan clock runs the scheduled run a day later; the work order is in the work-orders list as due, and
// is marked done with the time typed as people say it. Each screen scanned with axe and kept as a screenshot.
import { expect, test } from '@playwright/test';
import { demo, failOnConsoleErrors, scan, signIn } from './fixtures.ts';

/** The company's today (the demo company is in Chicago), as a date field takes it. */
const chicagoToday = () => new Intl.DateTimeFormat('en-CA', { timeZone: 'America/Chicago' }).format(new Date());

test('a dispatcher plans care for the last Tuesday of each month, and its work order falls due', async ({ page }) => {
  const consoleClean = failOnConsoleErrors(page);
  // A server error fails the test through the console check; its address is printed to say which request.
  page.on('response', (r) => {
    if (r.status() >= 500) console.log(`server error ${r.status()} on ${r.url()}`);
  });
  const name = `Glass and coin-door clean ${Date.now().toString(36)}`;
  await signIn(page, demo.dispatcher);

  await page.goto('/care-plans/new');
  await expect(page.getByRole('heading', { level: 1, name: 'New care plan' })).toBeVisible();
  await page.getByLabel('Name', { exact: true }).fill(name);
  // One game: its work order is the one to find.
  await page.getByLabel('One game', { exact: true }).check();
  const game = page.getByLabel('Game', { exact: true });
  await expect(game.locator('option').nth(1)).toBeAttached();
  await game.selectOption({ index: 1 });
  await page.getByLabel('Task 1', { exact: true }).fill('Clean the playfield glass');
  await page.getByRole('button', { name: 'Add a task' }).click();
  await page.getByLabel('Task 2', { exact: true }).fill('Empty and wipe the coin door');
  await page.getByLabel('Time on site', { exact: true }).fill('1 h 15');

  // A schedule that never falls on a date is refused as it is chosen.
  await page.getByLabel('Unit', { exact: true }).selectOption('year');
  await page.getByLabel('Month', { exact: true }).selectOption('2');
  await page.getByLabel('On day', { exact: true }).check();
  await page.getByLabel('Day of the month', { exact: true }).selectOption('31');
  await expect(page.getByText('This schedule never falls on a date')).toBeVisible();

  // The last Tuesday of every month, from today.
  await page.getByLabel('Starting on', { exact: true }).fill(chicagoToday());
  await page.getByLabel('At', { exact: true }).fill('09:00');
  await page.getByLabel('Unit', { exact: true }).selectOption('month');
  await page.getByLabel('On the', { exact: true }).check();
  await page.getByLabel('Which one', { exact: true }).selectOption('-1');
  await page.getByLabel('Which day', { exact: true }).selectOption('TU');
  await expect(page.getByText('Every month on the last Tuesday at 9:00', { exact: true })).toBeVisible();
  const nextDates = page.locator('#rule-words ol li');
  await expect(nextDates).toHaveCount(5);
  for (const text of await nextDates.allTextContents()) expect(text).toMatch(/^Tue, /);
  // Made up to six weeks ahead, so the first last-Tuesday is always inside the lead.
  await page.getByLabel('Make the work order this long before it is due', { exact: true }).fill('6 weeks');
  await scan(page, 'care-plan-editor');

  await page.getByRole('button', { name: 'Save care plan' }).click();
  await expect(page.getByRole('heading', { level: 1, name })).toBeVisible();
  await expect(page.getByText('Every month on the last Tuesday at 9:00')).toBeVisible();
  await scan(page, 'care-plan');

  // The demo's clock: run the scheduled care-plan run a day from now.
  await page.goto('/dev/care-plans');
  const tomorrow = new Date(Date.now() + 86_400_000).toISOString().slice(0, 16);
  await page.getByLabel('Run as of (UTC)', { exact: true }).fill(tomorrow);
  await page.getByRole('button', { name: 'Run the care-plan run' }).click();
  await expect(page.getByRole('status')).toContainText('work orders created');

  await page.goto(`/work-orders?q=${encodeURIComponent(name)}`);
  const row = page.getByRole('row').filter({ hasText: name });
  await expect(row).toHaveCount(1, { timeout: 10_000 });
  await expect(row.getByText(/Due soon|Overdue/)).toBeVisible();
  await scan(page, 'work-orders');

  await row.getByRole('link', { name }).click();
  await expect(page.getByRole('heading', { level: 1, name })).toBeVisible();
  await scan(page, 'work-order');
  await page.getByLabel('Time on site', { exact: true }).fill('1 h 10');
  await page.getByLabel('Note (optional)', { exact: true }).fill('Glass cleaned both sides');
  await page.getByRole('button', { name: 'Mark done' }).click();
  await expect(page.getByText('1 h 10 min on site')).toBeVisible();
  await expect(page.getByText('Done', { exact: true }).first()).toBeVisible();

  // The game's page shows its care-plan work, its meters and what it cost to keep running.
  await page.getByRole('link', { name: /\(LT-/ }).first().click();
  await expect(page.getByRole('heading', { name: 'Care-plan work' })).toBeVisible();
  await expect(page.getByText('Keep cost, last 12 months:')).toBeVisible();
  await expect(page.getByRole('link', { name })).toBeVisible();
  await scan(page, 'game-care-sections');
  consoleClean();
});
