// The navigation on a phone (390 × 844) for every role: nothing runs off the screen, the bottom bar holds the role's
// main destinations with large targets, "More" opens every section; both themes pass axe.
import { expect, test, type Page } from '@playwright/test';
import { demo, scan, signIn } from './fixtures.ts';

const PHONE = { width: 390, height: 844 };

async function noSidewaysScroll(page: Page) {
  const { scrollWidth, innerWidth } = await page.evaluate(() => ({
    scrollWidth: document.documentElement.scrollWidth,
    innerWidth: window.innerWidth,
  }));
  expect(scrollWidth, 'the page is no wider than the screen').toBeLessThanOrEqual(innerWidth);
}

const roles = [
  { who: 'technician', email: demo.technician, bar: ['My day', 'Calls', 'Van stock', 'More'], home: /\/my-day$/ },
  { who: 'owner', email: demo.owner, bar: ['Today', 'Calls', 'Route days', 'More'], home: /\/today$/ },
  { who: 'dispatcher', email: demo.dispatcher, bar: ['Today', 'Calls', 'Route days', 'More'], home: /\/today$/ },
  { who: 'venue contact', email: demo.venueContact, bar: ['My venue', 'More'], home: /\/today$/ },
] as const;

for (const role of roles) {
  test(`${role.who}: the phone's bars fit 390 px, targets are large, More opens every section`, async ({ browser }) => {
    const context = await browser.newContext({ viewport: PHONE, serviceWorkers: 'block' });
    const page = await context.newPage();
    await signIn(page, role.email);
    await expect(page).toHaveURL(role.home);
    await page.waitForLoadState('networkidle');

    const bar = page.getByRole('navigation', { name: 'Main' });
    await expect(bar).toBeVisible();
    const items = bar.locator('a, button');
    await expect(items).toHaveText(role.bar.map((label) => new RegExp(label)));
    for (const box of await items.evaluateAll((els) => els.map((e) => e.getBoundingClientRect().toJSON() as DOMRect))) {
      expect(box.height).toBeGreaterThanOrEqual(48);
      expect(box.width).toBeGreaterThanOrEqual(48);
      expect(box.right).toBeLessThanOrEqual(PHONE.width);
    }
    await noSidewaysScroll(page);
    // The wide screen's side navigation is not shown on a phone.
    await expect(page.getByRole('navigation', { name: 'Sections' })).toBeHidden();
    await scan(page, `phone-nav-${role.who.replace(' ', '-')}`);

    await bar.getByRole('button', { name: 'More' }).click();
    const sheet = page.getByRole('dialog', { name: 'Menu' });
    await expect(sheet).toBeVisible();
    await expect(sheet.getByRole('button', { name: 'Sign out' })).toBeVisible();
    await noSidewaysScroll(page);
    await scan(page, `phone-menu-${role.who.replace(' ', '-')}`);
    await sheet.getByRole('button', { name: 'Close' }).click();
    await expect(sheet).toBeHidden();
    await context.close();
  });
}

test('the dim theme: chosen on the phone, remembered after a reload, and it passes axe like the light one', async ({ browser }) => {
  const context = await browser.newContext({ viewport: PHONE, serviceWorkers: 'block' });
  const page = await context.newPage();
  await signIn(page, demo.technician);
  await page.waitForLoadState('networkidle');
  await expect(page.locator('html')).toHaveAttribute('data-theme', 'light');
  await page.getByRole('button', { name: /theme: switch/ }).click();
  await expect(page.locator('html')).toHaveAttribute('data-theme', 'dim');
  await page.reload();
  await expect(page.locator('html')).toHaveAttribute('data-theme', 'dim');
  await expect(page.getByRole('heading', { name: 'My day' })).toBeVisible();
  await scan(page, 'phone-my-day-dim');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('button', { name: 'More' }).click();
  await scan(page, 'phone-menu-dim');
  await context.close();
});

test("the phone's own dark setting picks the dim theme until a choice is made", async ({ browser }) => {
  const context = await browser.newContext({ viewport: PHONE, colorScheme: 'dark', serviceWorkers: 'block' });
  const page = await context.newPage();
  await signIn(page, demo.owner);
  await expect(page.locator('html')).toHaveAttribute('data-theme', 'dim');
  await expect(page.getByRole('heading', { name: 'Today' })).toBeVisible();
  await scan(page, 'phone-owner-today-dim');
  await context.close();
});

test('wide screens: the sections in groups down the side, each group only with what the role may open', async ({ page }) => {
  await page.setViewportSize({ width: 1280, height: 900 });
  await signIn(page, demo.technician);
  const side = page.getByRole('navigation', { name: 'Sections' });
  await expect(side).toBeVisible();
  for (const group of ['Work', 'Fleet', 'Bench', 'Stock']) await expect(side.getByRole('heading', { name: group })).toBeVisible();
  await expect(side.getByRole('heading', { name: 'Admin' })).toHaveCount(0);
  await expect(side.getByRole('link', { name: 'My day' })).toBeVisible();
  await expect(side.getByRole('link', { name: 'Route days' })).toHaveCount(0);
  await noSidewaysScroll(page);
  await scan(page, 'wide-nav-technician');
});
