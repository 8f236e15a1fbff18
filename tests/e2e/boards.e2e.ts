// Boards in games: the game page's boards and cabinet profile, a board's page with its reading charts, and the
// recap list — walked by a technician at desk and phone widths, each screen scanned with axe.
import { expect, test, type Page } from '@playwright/test';
import { demo, failOnConsoleErrors, openSection, scan, signIn } from './fixtures.ts';

interface FleetRow {
  boardInstanceId: string;
  gameId: string | null;
  recap: { status: string };
}

interface Fleet {
  items: FleetRow[];
  counts: Record<string, number>;
}

/** The demo's recap list as the API gives it (its largest page), to find a board with history and a game with boards. */
async function fleet(page: Page): Promise<Fleet> {
  const res = await page.request.get('/api/recap-due?limit=200');
  expect(res.ok()).toBe(true);
  return (await res.json()) as Fleet;
}

async function boardWithHistory(page: Page, rows: FleetRow[]): Promise<string> {
  for (const row of rows) {
    const res = await page.request.get(`/api/board-instances/${row.boardInstanceId}`);
    const body = (await res.json()) as { parts: { readings: unknown[] }[] };
    if (body.parts.some((p) => p.readings.length >= 3)) return row.boardInstanceId;
  }
  throw new Error('the demo has no board with three overhauls of readings');
}

for (const width of [1280, 390]) {
  test(`technician at ${width} px: a game's boards, a board's readings, the recap list`, async ({ page }) => {
    const check = failOnConsoleErrors(page);
    await page.setViewportSize({ width, height: width > 600 ? 900 : 844 });
    await signIn(page, demo.technician);
    const { items: rows, counts } = await fleet(page);
    const listed = Object.values(counts).reduce((a, b) => a + b, 0) - counts['no-electrolytics']!;
    const overdue = rows.find((r) => r.recap.status === 'overdue' && r.gameId)!;
    expect(overdue).toBeTruthy();

    // The game's page: its boards, a refused date code at the field, the cabinet profile.
    await page.goto(`/games/${overdue.gameId}`);
    await expect(page.getByRole('heading', { name: 'Boards' })).toBeVisible();
    await expect(page.getByText('Recap overdue').first()).toBeVisible();
    await page.getByRole('button', { name: 'Add board' }).click();
    await page.getByLabel('Date code as printed').fill('8954');
    await page.getByRole('button', { name: 'Add board' }).click();
    await expect(page.getByText('weeks run 01–53')).toBeVisible();
    await expect(page.getByLabel('Date code as printed')).toHaveValue('8954');
    await page.getByRole('button', { name: 'Cancel' }).click();
    await page.getByLabel('Stretch 1: Hours powered').fill('30 h');
    await page.getByRole('button', { name: 'Save profile' }).click();
    await expect(page.getByText('a day has 24 hours')).toBeVisible();
    await scan(page, `boards-game-${width}`);

    // A board with three overhauls: its charts load on demand, the numbers are also a table.
    const boardId = await boardWithHistory(page, rows);
    await page.goto(`/boards/${boardId}`);
    await expect(page.getByRole('heading', { name: 'Parts and their readings' })).toBeVisible();
    await expect(page.locator('.recharts-surface').first()).toBeVisible();
    await page
      .getByText(/all 3 readings as a table/)
      .first()
      .click();
    await expect(page.getByRole('table').first()).toBeVisible();
    await scan(page, `boards-board-${width}`);

    // The recap list, overdue first, filtered by status.
    await openSection(page, 'Recap due');
    await expect(page.getByRole('heading', { name: 'Recap due' })).toBeVisible();
    await expect(page.getByText(/recap now: overdue since/i).first()).toBeVisible();
    // One page of the ranking, with where it stands in the whole list; Next and Previous walk the pages.
    const shown = Math.min(50, listed);
    await expect(page.getByText(`Boards 1–${shown} of ${listed.toLocaleString('en-US')}`)).toBeVisible();
    await expect(page.getByRole('region', { name: 'Boards by recap due' }).getByRole('listitem')).toHaveCount(shown);
    if (listed > 50) {
      await page.getByRole('button', { name: 'Next' }).click();
      await expect(page).toHaveURL(/cursor=/);
      await expect(page.getByText(`Boards 51–${Math.min(100, listed)} of`)).toBeVisible();
      await page.getByRole('button', { name: 'Previous' }).click();
      await expect(page.getByText(`Boards 1–${shown} of`)).toBeVisible();
    }
    await expect(page.getByRole('button', { name: 'Previous' })).toBeDisabled();
    await page.getByLabel('Status').selectOption('due-soon');
    await expect(page).toHaveURL(/status=due-soon/);
    await page.getByLabel('Status').selectOption('');
    await scan(page, `boards-recap-due-${width}`);
    check();
  });
}
