// A technician keeps a model's parts list in Chromium: the keyboard moves between cells as in a spreadsheet,
// rows pasted from a spreadsheet fill the table, each cell shows its problem as it is typed, a save by someone
// else in between is reported rather than overwritten, and a CSV file comes in only once it has no problems.
import { expect, test, type Page } from '@playwright/test';
import { demo, failOnConsoleErrors, openSection, scan, signIn } from './fixtures.ts';

const HEADER = 'designator,kind,value,tolerance,rating,rated_temperature_c,rated_life_hours,notes';

/** What a spreadsheet puts on the clipboard, pasted into the focused cell. */
async function paste(page: Page, text: string) {
  await page.evaluate((data) => {
    const transfer = new DataTransfer();
    transfer.setData('text/plain', data);
    document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: transfer, bubbles: true, cancelable: true }));
  }, text);
}

const cell = (page: Page, column: string, designator: string) => page.getByLabel(`${column} of ${designator}`, { exact: true });

test('a technician edits a power supply’s parts list with the keyboard, a paste and a CSV file', async ({ page }) => {
  const check = failOnConsoleErrors(page);
  page.on('dialog', (d) => d.accept());
  await page.setViewportSize({ width: 1280, height: 900 });
  await signIn(page, demo.technician);
  await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Parts lists' }).click();
  await expect(page.getByRole('region', { name: 'Comet Carnival' }).getByText('65 parts')).toBeVisible();
  await scan(page, 'parts-lists');
  await page.getByRole('region', { name: 'Comet Carnival' }).getByRole('link', { name: 'Power supply' }).click();
  await expect(page.getByText('65 rows')).toBeVisible();
  await scan(page, 'parts-list');

  // The filter narrows the list at once.
  await page.getByLabel('Filter parts').fill('electrolytic');
  await expect(page.getByText('9 of 65 rows')).toBeVisible();
  await page.getByLabel('Filter parts').fill('');

  // Arrows and Enter move between cells (of the rows shown); typing replaces the cell; the problem shows under it
  // as typed.
  await page.getByLabel('Filter parts').fill('resistor');
  await cell(page, 'Value', 'R1').focus();
  await page.keyboard.press('ArrowDown');
  await expect(cell(page, 'Value', 'R2')).toBeFocused();
  await page.keyboard.type('100µF');
  await expect(page.getByText("µF is a capacitor's unit; a resistor's value is in Ω, e.g. 4k7")).toBeVisible();
  await expect(cell(page, 'Value', 'R2')).toHaveAttribute('aria-invalid', 'true');
  await page.keyboard.press('Escape');
  await expect(cell(page, 'Value', 'R2')).toHaveValue('4k7');
  await page.keyboard.press('ArrowRight');
  await expect(cell(page, 'Tolerance', 'R2')).toBeFocused();
  await page.keyboard.press('Enter');
  await expect(cell(page, 'Tolerance', 'R3')).toBeFocused();
  await page.keyboard.press('Shift+Tab');
  await expect(cell(page, 'Value', 'R3')).toBeFocused();
  await page.getByLabel('Filter parts').fill('');

  // Rows copied from a spreadsheet fill from the current cell, with new rows past the end.
  await page.getByRole('button', { name: 'Add a row' }).click();
  await expect(cell(page, 'Designator', 'row 66')).toBeFocused();
  await paste(page, 'R15\tResistor\t3k3\t5%\t1/4 W\r\nC15\tElectrolytic capacitor\t470µF\t20%\t35 V\t105\t2000\r\n');
  await expect(page.getByText('Pasted 2 rows.')).toBeVisible();
  await expect(cell(page, 'Value', 'C15')).toHaveValue('470µF');
  await expect(page.getByText('67 rows')).toBeVisible();
  await page.getByRole('button', { name: 'Save' }).click();
  await expect(page.getByText('Saved 67 parts.')).toBeVisible();

  // A file with problems brings nothing in; the corrected file replaces the rows, to be saved.
  const file = (name: string, lines: string[]) => ({ name, mimeType: 'text/csv', buffer: Buffer.from([HEADER, ...lines].join('\r\n')) });
  await page
    .locator('input[type=file]')
    .setInputFiles(file('psu.csv', ['F1,fuse,T2.5A 250V,,,,,', 'R1,resistor,600,150%,5 W,,,', 'r1,resistor,1k,5%,,,,']));
  await expect(page.getByRole('heading', { name: 'psu.csv: nothing imported yet' })).toBeVisible();
  await expect(page.getByText('a tolerance over 100 % is not a real part tolerance (got 150 %)')).toBeVisible();
  await expect(page.getByText('67 rows')).toBeVisible();
  await scan(page, 'parts-list-import-problems');
  await page.locator('input[type=file]').setInputFiles(file('psu.csv', ['F1,fuse,T2.5A 250V,,,,,', 'R1,resistor,600,10%,5 W,,,']));
  await expect(page.getByText('Imported 2 parts from psu.csv. Not saved yet: save to keep them.')).toBeVisible();
  await expect(page.getByText('2 rows')).toBeVisible();
  await page.getByRole('button', { name: 'Undo import' }).click();
  await expect(page.getByText('67 rows')).toBeVisible();

  // The same list opened elsewhere and saved there first: this save is turned away, the rows kept. The browser
  // logs the refused request (409) and nothing else.
  check();
  const logged: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error') logged.push(m.text());
  });
  page.on('pageerror', (e) => logged.push(e.message));
  const other = await page.context().newPage();
  await other.goto(page.url());
  await cell(other, 'Notes', 'F3').fill('replaced 2026');
  await other.getByRole('button', { name: 'Save' }).click();
  await expect(other.getByText('Saved 67 parts.')).toBeVisible();
  await other.close();
  await cell(page, 'Notes', 'F4').fill('checked');
  await page.getByRole('button', { name: 'Save' }).click();
  await expect(page.getByText('Someone else saved this parts list since you opened it.')).toBeVisible();
  await expect(cell(page, 'Notes', 'F4')).toHaveValue('checked');
  await scan(page, 'parts-list-conflict');
  await page.getByRole('button', { name: 'Load the saved list (drop my changes)' }).click();
  await expect(cell(page, 'Notes', 'F3')).toHaveValue('replaced 2026');
  await expect(cell(page, 'Notes', 'F4')).toHaveValue('solenoid 50 V');

  // On a phone the table scrolls sideways inside its frame; the page itself does not.
  await page.setViewportSize({ width: 390, height: 844 });
  await page.getByLabel('Filter parts').fill('');
  const frame = page.getByRole('region', { name: 'Parts list cells' });
  expect(await frame.evaluate((el) => el.scrollWidth > el.clientWidth)).toBe(true);
  expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth)).toBe(true);
  await frame.scrollIntoViewIfNeeded();
  // Scrolled sideways, the designators stay in view.
  await frame.evaluate((el) => el.scrollBy(320, 0));
  await expect(cell(page, 'Designator', 'F1')).toBeInViewport();
  await page.screenshot({ path: 'e2e/screenshots/parts-list-phone.png' });
  await openSection(page, 'Parts lists');
  await expect(page.getByRole('heading', { name: 'Parts lists', level: 1 })).toBeVisible();
  await page.screenshot({ path: 'e2e/screenshots/parts-lists-phone.png', fullPage: true });
  expect(logged).toEqual(['Failed to load resource: the server responded with a status of 409 (Conflict)']);
});
