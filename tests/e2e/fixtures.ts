// Shared steps for the browser tests: sign in as a demo person, scan a screen with axe, keep a screenshot.
import { expect, type Locator, type Page } from '@playwright/test';
import AxeBuilder from '@axe-core/playwright';

export const DEMO_PASSWORD = 'bumperline-demo';
export const demo = {
  owner: 'owner@lakeshore.example',
  dispatcher: 'dispatch@lakeshore.example',
  technician: 'tech1@lakeshore.example',
  venueContact: 'venue@lakeshore.example',
  secondOwner: 'owner@prairie.example',
};

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { level: 1 })).not.toHaveText('Sign in');
}

/**
 * Opens a section of the app as a person would: from the side navigation on a wide screen, from "More" on a phone
 * (where the bottom bar holds only the role's main destinations).
 */
export async function openSection(page: Page, name: string) {
  const side = page.getByRole('navigation', { name: 'Sections' });
  if (await side.isVisible()) return side.getByRole('link', { name, exact: true }).click();
  await page.getByRole('navigation', { name: 'Main' }).getByRole('button', { name: 'More' }).click();
  await page.getByRole('dialog', { name: 'Menu' }).getByRole('link', { name, exact: true }).click();
}

/** Fails on any serious or critical accessibility violation (axe-core, WCAG 2.x A/AA rules). */
export async function scan(page: Page, name: string) {
  await page.waitForLoadState('networkidle');
  // Judged at rest at the top: scrolled, content passes under the sticky top bar, which axe counts as an overlapped target.
  await page.evaluate(() => window.scrollTo(0, 0));
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  const bad = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  await page.screenshot({ path: `e2e/screenshots/${name}.png`, fullPage: true });
  expect(
    bad.map(
      (v) =>
        `${v.id}: ${v.help} (${v.nodes
          .map((n) => n.target.join(' '))
          .slice(0, 3)
          .join(', ')})`,
    ),
    `axe on ${name}`,
  ).toEqual([]);
}

/** Any console error in the page fails the test. */
export function failOnConsoleErrors(page: Page) {
  const errors: string[] = [];
  page.on('console', (m) => {
    // A 401 from /api/account/me is how a signed-out page learns it is signed out.
    if (m.type() === 'error' && !/401 \(Unauthorized\)/.test(m.text())) errors.push(m.text());
  });
  page.on('pageerror', (e) => errors.push(e.message));
  return () => expect(errors).toEqual([]);
}

/** Drags a route stop by its handle onto a target in small steps, as a hand would (dnd-kit waits for 6 px of travel). */
export async function dragStop(page: Page, stop: Locator, target: Locator) {
  const handle = stop.getByRole('button', { name: /^Drag / });
  await handle.scrollIntoViewIfNeeded();
  const from = (await handle.boundingBox())!;
  await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
  await page.mouse.down();
  await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2 - 12, { steps: 4 });
  const to = (await target.boundingBox())!;
  await page.mouse.move(to.x + to.width / 2, to.y + 8, { steps: 20 });
  await page.mouse.up();
}
