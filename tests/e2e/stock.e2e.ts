// Stock in the browser: the office moves fuses from the shop's shelves onto a technician's van, the technician
// counts the van on a phone and sees the difference, a part at its reorder point is on the list to order, and
// the list downloads as CSV.
import { readFile } from 'node:fs/promises';
import { expect, test, type Browser, type Page } from '@playwright/test';
import type { CataloguePage, CataloguePartDetail } from '@bumperline/contracts/parts-catalogue';
import type { MyVan, StockLocationList } from '@bumperline/contracts/stock';
import { demo, scan, signIn } from './fixtures.ts';

const PHONE = { width: 390, height: 844 };
const JSON_HEADERS = { 'X-Requested-With': 'bumperline', 'Content-Type': 'application/json' };

async function personAt(browser: Browser, email: string, viewport = { width: 1280, height: 900 }): Promise<Page> {
  const context = await browser.newContext({ viewport });
  const page = await context.newPage();
  await signIn(page, email);
  return page;
}

const json = async <T>(page: Page, url: string) => (await (await page.request.get(url)).json()) as T;

test('the office moves fuses to a van, the technician counts it, the reorder list shows a part and downloads', async ({ browser }) => {
  test.setTimeout(120_000);
  const phone = await personAt(browser, demo.technician, PHONE);
  const office = await personAt(browser, demo.dispatcher);

  // The technician's van, as the phone shows it.
  await phone.goto('/van');
  await expect(phone.getByRole('heading', { name: 'Van stock' })).toBeVisible();
  const van = (await json<MyVan>(phone, '/api/stock/my-van')).location!;
  expect(van, 'the demo technician has a van').toBeTruthy();
  await scan(phone, 'van-stock-phone');

  // A fuse the shop holds.
  const fuses = await json<CataloguePage>(office, '/api/parts?q=FU-&limit=50');
  const shelves = (await json<StockLocationList>(office, '/api/stock/locations')).items.find((l) => l.name === 'Shop shelves')!;
  const withStock = [];
  for (const part of fuses.items) {
    const detail = await json<CataloguePartDetail>(office, `/api/parts/${part.id}`);
    if ((detail.holdings.find((h) => h.locationId === shelves.id)?.quantity ?? 0) >= 5) withStock.push(detail);
    if (withStock.length) break;
  }
  expect(withStock.length, 'the shop holds at least one fuse').toBe(1);
  const fuse = withStock[0]!.part;
  const onVanBefore = withStock[0]!.holdings.find((h) => h.locationId === van.id)?.quantity ?? 0;

  // The office moves two from the shelves to the van.
  await office.goto('/stock');
  await office.getByRole('link', { name: 'Shop shelves' }).click();
  await expect(office.getByRole('heading', { name: 'Shop shelves', level: 1 })).toBeVisible();
  const transfer = office.getByRole('form', { name: 'Move from Shop shelves' });
  await transfer.getByLabel('To', { exact: true }).selectOption({ label: van.name });
  await transfer.getByLabel('Part: search').fill(fuse.partNumber);
  await expect(transfer.getByLabel('Part', { exact: true }).locator('option', { hasText: fuse.partNumber })).toHaveCount(1);
  await transfer.getByLabel('Part', { exact: true }).selectOption({ index: 1 });
  await transfer.getByLabel('How many').fill('2');
  await transfer.getByRole('button', { name: 'Move it' }).click();
  await expect(transfer.getByRole('status')).toHaveText(`Moved 2 of ${fuse.partNumber} from Shop shelves to ${van.name}.`);
  await scan(office, 'stock-location');

  // The technician counts one fewer than the van says.
  const onVan = onVanBefore + 2;
  await phone.reload();
  await expect(phone.getByRole('list', { name: 'On your van' }).getByText(fuse.partNumber, { exact: true })).toBeVisible();
  await phone.getByRole('button', { name: 'Count' }).click();
  const count = phone.getByRole('form', { name: `Count ${van.name}` });
  await count.getByLabel('Part: search').fill(fuse.partNumber);
  await expect(count.getByLabel('Part', { exact: true }).locator('option', { hasText: fuse.partNumber })).toHaveCount(1);
  await count.getByLabel('Part', { exact: true }).selectOption({ index: 1 });
  await count.getByLabel('Counted').fill(String(onVan - 1));
  await count.getByRole('button', { name: 'Save the count' }).click();
  await expect(count.getByRole('status')).toHaveText(
    `Counted ${onVan - 1} of ${fuse.partNumber} — 1 fewer than the stock said (${onVan}).`,
  );
  await scan(phone, 'van-count-phone');

  // The shelves' fuse at its reorder point: it is on the list to order.
  const level = (await json<CataloguePartDetail>(office, `/api/parts/${fuse.id}`)).holdings.find((h) => h.locationId === shelves.id)!;
  const put = await office.request.put(`/api/stock/locations/${shelves.id}/levels/${fuse.id}`, {
    headers: JSON_HEADERS,
    data: { reorderPoint: level.quantity, reorderQuantity: 100, version: level.version },
  });
  expect(put.status()).toBe(200);
  await office.goto('/stock/reorder');
  await expect(office.getByRole('heading', { name: 'What to order' })).toBeVisible();
  await expect(office.getByRole('link', { name: fuse.partNumber })).toBeVisible();
  await scan(office, 'reorder');
  const [download] = await Promise.all([office.waitForEvent('download'), office.getByRole('button', { name: 'Download CSV' }).click()]);
  const csv = await readFile((await download.path())!, 'utf8');
  expect(csv.split('\n')[0]).toContain('supplier,part_number');
  expect(csv).toContain(`${fuse.partNumber},`);
});

test('the catalogue lists parts and a part page shows where it is kept', async ({ browser }) => {
  const office = await personAt(browser, demo.dispatcher);
  await office.goto('/parts');
  await expect(office.getByRole('heading', { name: 'Parts', level: 1 })).toBeVisible();
  await office.getByPlaceholder('Search parts by number or description').fill('FU-');
  const first = office.getByRole('table').getByRole('link').first();
  await expect(first).toContainText('FU-');
  await scan(office, 'parts');
  await first.click();
  await expect(office.getByRole('heading', { name: 'Where it is kept' })).toBeVisible();
  await expect(office.getByText('Shop shelves').first()).toBeVisible();
  await scan(office, 'part');
});
