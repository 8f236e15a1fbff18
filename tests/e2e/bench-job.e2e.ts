// A bench job on a phone, start to finish: a technician opens the power-supply recap template for a game's board →
// acknowledges the mains caution → records a fuse replacement that is refused for the wrong speed, then accepted →
// enters readings where one resistor reads high and shows its window → records the parts used → finishes → the job
// sheet's PDF lists the out-of-tolerance part → the board's history shows the new reading beside the earlier ones.
import { expect, test, type APIRequestContext, type Page } from '@playwright/test';
import { PDFParse } from 'pdf-parse';
import sharp from 'sharp';
import { demo, scan, signIn } from './fixtures.ts';

const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1280, height: 900 };

/** Signs an API request context in as a demo person through Auth.js, like the web app does. */
async function apiAs(request: APIRequestContext, email: string) {
  const { csrfToken } = await (await request.get('/auth/csrf')).json();
  await request.post('/auth/callback/credentials', {
    form: { csrfToken, email, password: 'bumperline-demo' },
    headers: { 'X-Auth-Return-Redirect': '1' },
  });
}

interface BoardPageAnswer {
  instance: { id: string; boardName: string; gameId: string | null };
  parts: { designator: string; readings: { measuredText: string }[] }[];
}

/** A Comet Carnival power supply in a game whose bleeder R7 (600 Ω ±10 %) was read on earlier overhauls. */
async function pickSupply(request: APIRequestContext) {
  await apiAs(request, demo.technician);
  const games = await (await request.get('/api/games', { params: { q: 'Comet Carnival', limit: 50 } })).json();
  let best: { gameId: string; boardId: string; earlier: string[] } | null = null;
  for (const game of games.items as { id: string }[]) {
    const boards = await (await request.get(`/api/games/${game.id}/boards`)).json();
    for (const b of boards.items as { id: string; boardName: string }[]) {
      if (b.boardName !== 'Power supply') continue;
      const page = (await (await request.get(`/api/board-instances/${b.id}`)).json()) as BoardPageAnswer;
      const r7 = page.parts.find((p) => p.designator === 'R7');
      const earlier = r7?.readings.map((r) => r.measuredText) ?? [];
      if (earlier.length >= 2 && (!best || earlier.length > best.earlier.length)) best = { gameId: game.id, boardId: b.id, earlier };
    }
  }
  expect(best, 'a Comet Carnival power supply with earlier readings on R7').not.toBeNull();
  return best!;
}

/** Opens a step from the job's step list (folded away on a phone). */
async function openStep(page: Page, title: string) {
  const steps = page.getByRole('navigation', { name: 'Steps' });
  await steps.getByText('All steps').click();
  await steps.getByRole('button').filter({ hasText: title }).click();
  await expect(page.getByRole('heading', { level: 2, name: title })).toBeVisible();
}

test('bench job on a phone: caution, fuse refused then accepted, a high reading, parts used, finish, sheet PDF, board history', async ({
  browser,
  request,
}) => {
  test.setTimeout(180_000);
  const supply = await pickSupply(request);

  const phone = await browser.newContext({ viewport: PHONE });
  const page = await phone.newPage();
  await signIn(page, demo.technician);

  // 1. From the game's page to its power supply, and a new job from the recap template.
  await page.goto(`/games/${supply.gameId}`);
  await page.getByRole('region', { name: 'Boards' }).getByRole('link', { name: 'Power supply' }).first().click();
  await expect(page).toHaveURL(new RegExp(`/boards/${supply.boardId}$`));
  await page.getByRole('link', { name: 'Start bench job' }).click();
  await expect(page.getByRole('heading', { name: 'Start a bench job' })).toBeVisible();
  await page.getByRole('radio', { name: /Power supply recap and reflow/ }).check();
  await scan(page, 'bench-phone-start');
  await page.getByRole('button', { name: 'Open the bench job' }).click();
  await expect(page).toHaveURL(/\/bench\/jobs\/[0-9a-f-]+/);
  const jobId = /\/bench\/jobs\/([0-9a-f-]+)/.exec(page.url())![1]!;

  // 2. The first step opens the supply: the mains caution in full, and "Done" waits for the acknowledgement.
  await expect(page.getByRole('heading', { level: 2, name: 'Unplug and verify dead' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Caution: Mains voltage' })).toBeVisible();
  await expect(page.getByText(/verify it is dead with a meter/)).toBeVisible();
  await expect(page.getByText(/Follow local codes, the maker’s instructions and licensed practice/)).toBeVisible();
  const done = page.getByRole('checkbox', { name: 'Done', exact: true });
  await expect(done).toBeDisabled();
  await expect(page.getByText(/Tick “I have read the cautions” first/)).toBeVisible();
  await scan(page, 'bench-phone-caution');
  await page.getByLabel('I have read the cautions').check();
  await page.getByRole('radio', { name: 'Yes' }).check();
  await expect(done).toBeEnabled();
  await done.check();

  // 3. A fuse replacement: a quick-acting fuse in a time-lag circuit is refused, saying why; the right one is accepted.
  await openStep(page, 'Check the fuses');
  const f1 = page.getByLabel('Marking on the fuse fitted in F1');
  const f1Row = page.getByRole('listitem').filter({ has: f1 });
  await expect(f1Row).toContainText('Circuit needs T2.5A 250V');
  await f1.fill('F2.5A 250V');
  await expect(f1Row).toContainText('REFUSED');
  await expect(f1Row).toContainText(/quick-acting \(F\).*time-lag \(T\)/);
  await scan(page, 'bench-phone-fuse-refused');
  await f1.fill('T2.5A 250V');
  await expect(f1Row).toContainText('ACCEPTED');
  await expect(f1Row).not.toContainText('REFUSED');
  await page.getByRole('checkbox', { name: 'Done', exact: true }).check();

  // 4. Readings, judged as typed: bad text keeps the text and says why; R7 reads high against its window.
  await openStep(page, 'Measure the resistors');
  const r2 = page.getByLabel('R2 reading');
  await r2.fill('abc');
  await expect(page.getByText('“abc” is not a reading — type a value such as 4.7k')).toBeVisible();
  await expect(r2).toHaveValue('abc');
  await r2.fill('4.68k');
  const r2Row = page.getByRole('listitem').filter({ has: r2 });
  await expect(r2Row).toContainText('PASS');
  await expect(r2Row).toContainText('4.465 kΩ – 4.935 kΩ');
  const r7 = page.getByLabel('R7 reading');
  await r7.fill('672');
  const r7Row = page.getByRole('listitem').filter({ has: r7 });
  await expect(r7Row).toContainText('HIGH');
  await expect(r7Row).toContainText('540 Ω – 660 Ω');
  await expect(r7Row).toContainText('+12.0 %');
  await scan(page, 'bench-phone-readings');
  await page.getByRole('checkbox', { name: 'Done', exact: true }).check();

  // 5. Parts used on the recap: one off the parts list, one written in.
  await openStep(page, 'Recap');
  await page.getByLabel('I have read the cautions').check();
  await page.getByLabel('Add a part from the parts list').selectOption({ label: 'C1 — 15000µF (electrolytic capacitor)' });
  await page.getByRole('button', { name: 'Add', exact: true }).click();
  await page.getByRole('button', { name: 'Add a part not on the list' }).click();
  await page.getByRole('textbox', { name: 'Part 2' }).fill('Fuse T2.5A 250V 5×20 mm');
  await page.getByRole('textbox', { name: 'Quantity' }).nth(1).fill('2');
  await page.getByRole('checkbox', { name: 'Done', exact: true }).check();
  await expect(page.getByText(/^Saved \d/)).toBeVisible({ timeout: 10_000 });
  await scan(page, 'bench-phone-parts-used');

  // 6. Finishing is refused while a step ticked done lacks what it records: the problem shows at its field,
  //    with the step opened for it; the rest of the job is kept.
  await openStep(page, 'Photo of the finished board');
  await page.getByRole('checkbox', { name: 'Done', exact: true }).check();
  await openStep(page, 'Finish the job');
  await page.getByRole('button', { name: 'Finish the job' }).click();
  await expect(page.getByText('Not finished: 1 thing needs fixing. Your entries are kept.')).toBeVisible();
  await expect(page.getByRole('heading', { level: 2, name: 'Photo of the finished board' })).toBeVisible();
  await expect(page.getByText('Add a photo before ticking this step')).toBeVisible();
  await scan(page, 'bench-phone-finish-refused');
  const photo = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 40, g: 90, b: 60 } } })
    .jpeg()
    .toBuffer();
  await page.getByLabel('Take or upload a photo').setInputFiles({ name: 'board.jpg', mimeType: 'image/jpeg', buffer: photo });
  await expect(page.getByRole('img', { name: 'Photo 1 on “Photo of the finished board”' })).toBeVisible();

  // 7. Finish: the server judges it all again and the job becomes read-only, with its sheet.
  await openStep(page, 'Finish the job');
  await page.getByRole('button', { name: 'Finish the job' }).click();
  await expect(page.getByText(/^Finished by /)).toBeVisible({ timeout: 15_000 });
  await expect(page.getByRole('button', { name: 'Finish the job' })).toHaveCount(0);
  await scan(page, 'bench-phone-finished');

  // 8. The job sheet names the out-of-tolerance part in words; its PDF says the same.
  await page.getByRole('link', { name: 'Job sheet', exact: true }).click();
  await expect(page.getByRole('heading', { name: 'Out of tolerance' })).toBeVisible();
  await expect(page.getByText('R7 reads HIGH: 672 Ω against 540 Ω – 660 Ω (+12.0 %) — out of tolerance')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Print' })).toBeVisible();
  await scan(page, 'bench-phone-sheet');
  const pdfLink = page.getByRole('link', { name: 'PDF' });
  await expect(pdfLink).toHaveAttribute('href', `/api/bench-jobs/${jobId}/sheet.pdf`);
  const pdf = await page.request.get(`/api/bench-jobs/${jobId}/sheet.pdf`);
  expect(pdf.status()).toBe(200);
  expect(pdf.headers()['content-type']).toContain('application/pdf');
  const parser = new PDFParse({ data: new Uint8Array(await pdf.body()) });
  const text = (await parser.getText()).text;
  await parser.destroy();
  expect(text).toContain('R7');
  expect(text).toMatch(/672/);
  expect(text).toContain('OUT OF TOLERANCE — HIGH');

  // Printed, the sheet is the page alone: no navigation.
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('navigation', { name: 'Sections' })).toBeHidden();
  await page.screenshot({ path: 'e2e/screenshots/bench-sheet-print.png', fullPage: true });
  await page.emulateMedia({ media: 'screen' });

  // 9. The board's history: the new reading beside the earlier ones.
  await page.goto(`/boards/${supply.boardId}`);
  const r7Line = page.getByRole('listitem').filter({ has: page.getByText('R7: all', { exact: false }) });
  await expect(r7Line).toContainText('672 Ω');
  await r7Line.getByText(/^R7: all \d+ readings as a table$/).click();
  const table = page.getByRole('table', { name: /Readings of R7/ });
  await expect(table.getByRole('row')).toHaveCount(supply.earlier.length + 2);
  await expect(table.getByRole('row').last()).toContainText('672 Ω');
  await scan(page, 'bench-phone-board-history');

  // The same screens at desktop width.
  const desktop = await browser.newContext({ viewport: DESKTOP });
  const wide = await desktop.newPage();
  await signIn(wide, demo.technician);
  await wide.goto(`/bench/jobs/${jobId}?step=measure-resistors`);
  await expect(wide.getByRole('heading', { level: 2, name: 'Measure the resistors' })).toBeVisible();
  await scan(wide, 'bench-desktop-job');
  await wide.goto(`/bench/jobs/${jobId}/sheet`);
  await expect(wide.getByText(/R7 reads HIGH/)).toBeVisible();
  await scan(wide, 'bench-desktop-sheet');
  await wide.goto('/bench');
  await expect(wide.getByRole('heading', { name: 'Finished lately' })).toBeVisible();
  await scan(wide, 'bench-desktop-bench');
  await phone.close();
  await desktop.close();
});

test('bench templates: read one with its cautions in full, write one, reorder its steps; refusals shown at the field', async ({ page }) => {
  await page.setViewportSize(PHONE);
  await signIn(page, demo.technician);
  await page.goto('/bench');
  await page.getByRole('link', { name: 'Power supply recap and reflow' }).click();
  await expect(page.getByRole('heading', { level: 2, name: /Unplug and verify dead/ })).toBeVisible();
  await expect(page.getByText(/Filter capacitors can hold a dangerous charge/)).toBeVisible();
  await expect(page.getByRole('link', { name: 'Blank sheet (PDF)' })).toHaveAttribute(
    'href',
    /\/api\/bench-templates\/[0-9a-f-]+\/sheet\.pdf$/,
  );
  await scan(page, 'bench-phone-template');

  await page.goto('/bench/templates/new');
  await page.getByRole('textbox', { name: 'Name' }).fill('Driver board quick check');
  await page.getByRole('textbox', { name: 'Title' }).fill('Measure the coil resistors');
  await page.getByLabel('What the step records').selectOption('readings');
  // A readings step must say which parts: the server refuses it, and says so at the field.
  await page.getByRole('button', { name: 'Save the template' }).click();
  await expect(page.getByText('Must name the part kinds or the designators this step measures')).toBeVisible();
  await expect(page.getByRole('textbox', { name: 'Title' })).toHaveValue('Measure the coil resistors');
  await page.getByRole('checkbox', { name: 'Resistor' }).check();
  await page.getByRole('button', { name: 'Add a step' }).click();
  await page.getByRole('textbox', { name: 'Title' }).nth(1).fill('Reflow the connector joints');
  await page.getByRole('checkbox', { name: 'Hot iron' }).nth(1).check();
  await page.getByRole('button', { name: 'Move step 2 up' }).click();
  await scan(page, 'bench-phone-template-editor');
  await page.getByRole('button', { name: 'Save the template' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Driver board quick check' })).toBeVisible();
  const steps = page.getByRole('listitem').filter({ has: page.getByRole('heading', { level: 2 }) });
  await expect(steps.nth(0)).toContainText('Reflow the connector joints');
  await expect(steps.nth(0)).toContainText('Caution: Hot iron');
  await expect(steps.nth(1)).toContainText('Measure the coil resistors');
  await expect(steps.nth(1)).toContainText('every resistor');
});
