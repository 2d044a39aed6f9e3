import { expect, test, type Page } from '@playwright/test';
import { DEMO, signInWithPassword } from './support/auth';
import { canvas, expectedPulses, openingView, pointOnCanvas, previewNumber, previewSettled, readTable } from './support/envelope-editor';

// A new optical envelope starts from the engine's worked example: ramp 2→12 Hz over 30 s,
// hold 12 Hz for 60 s, sine 10 ± 8 Hz for 90 s; ceiling 25 Hz, rate cap 40 Hz. The editor
// opens on the whole 180 s with rates up to 110 % of the cap.
const STARTER = { durationS: 180, topHz: 40, segments: 3 };
const startView = openingView(STARTER.durationS, STARTER.topHz);

const segmentKinds = (page: Page) => page.getByRole('combobox', { name: /^Segment \d+ kind$/ });

async function newOpticalEnvelope(page: Page) {
  await page.goto('/envelopes');
  await page.getByRole('button', { name: 'New optical envelope' }).click();
  await expect(page).toHaveURL(/\/envelopes\/[0-9a-f-]{36}$/);
  await expect(canvas(page)).toBeVisible();
  await expect(segmentKinds(page)).toHaveCount(STARTER.segments);
  return page.url().split('/').pop()!;
}

/** The canvas's own status line (what a click or a drag did). */
const status = (page: Page) => page.getByRole('status').filter({ hasText: /^(Added|Moved|Point at|No point)/ });

async function expectPreviewMatchesTable(page: Page) {
  // The preview's expected count is the integral of the envelope now in the table.
  await expect(async () => {
    await previewSettled(page);
    const want = expectedPulses(await readTable(page)).toFixed(1);
    await expect(previewNumber(page, 'Expected pulses / trial')).toHaveText(new RegExp(`^${want.replace('.', '\\.')}`), { timeout: 1000 });
  }).toPass({ timeout: 30_000 });
}

test('an experimenter draws, drags, undoes, inserts a sine, previews, saves, renames, duplicates, deletes and restores an envelope', async ({ page }) => {
  test.setTimeout(150_000);
  const stamp = `Editor run ${Date.now()}`;
  await signInWithPassword(page, DEMO.experimenter);
  await newOpticalEnvelope(page);
  await expectPreviewMatchesTable(page);
  // The starter's integral in closed form: 30·(2+12)/2 + 60·12 + 90·10 (the sine spans whole cycles) = 1830.
  await expect(previewNumber(page, 'Expected pulses / trial')).toHaveText(/^1830\.0/);

  // Click on the canvas: a breakpoint at 15 s, 20 Hz splits the first ramp.
  const a = await pointOnCanvas(page, startView, 15, 20);
  await page.mouse.click(a.x, a.y);
  await expect(status(page)).toHaveText(/^Added\. Point at 1[45]\.\d{3} s, 20\.0 Hz\.$/);
  let rows = await readTable(page);
  expect(rows).toHaveLength(4);
  expect(rows[0]).toMatchObject({ kind: 'ramp', fromHz: 2, toHz: 20 });
  expect(rows[1]).toMatchObject({ kind: 'ramp', fromHz: 20, toHz: 12 });
  expect(rows[0].durationS).toBeCloseTo(15, 0);
  expect(rows[0].durationS + rows[1].durationS).toBeCloseTo(30, 9);
  const clickedT = rows[0].durationS;

  // A second click splits the 12 Hz hold at 45 s, 6 Hz.
  const b = await pointOnCanvas(page, startView, 45, 6);
  await page.mouse.click(b.x, b.y);
  await expect(segmentKinds(page)).toHaveCount(5);
  rows = await readTable(page);
  expect(rows).toHaveLength(5);
  expect(rows[2]).toMatchObject({ kind: 'ramp', fromHz: 12, toHz: 6 });
  expect(rows[3]).toMatchObject({ kind: 'ramp', fromHz: 6, toHz: 12 });
  expect(rows[0].durationS + rows[1].durationS + rows[2].durationS).toBeCloseTo(45, 0);

  // Drag the first point down to 10 Hz: one pointer press, several moves, one release.
  const to = await pointOnCanvas(page, startView, 15, 10);
  await page.mouse.move(a.x, a.y);
  await page.mouse.down();
  for (let k = 1; k <= 8; k++) await page.mouse.move(a.x, a.y + ((to.y - a.y) * k) / 8);
  await page.mouse.up();
  await expect(status(page)).toHaveText(/^Moved\. Point at .* 10\.0 Hz\.$/);
  rows = await readTable(page);
  expect(rows[0]).toMatchObject({ toHz: 10, durationS: clickedT });
  expect(rows[1]).toMatchObject({ fromHz: 10 });

  // Ctrl+Z takes the whole drag back in one step.
  await canvas(page).press('Control+z');
  await expect(page.getByLabel('Segment 1 to (Hz)', { exact: true })).toHaveValue('20');
  await expect(page.getByLabel('Segment 2 from (Hz)', { exact: true })).toHaveValue('20');
  await expect(page.getByRole('button', { name: 'Redo' })).toBeEnabled();

  // Keyboard path: with the point selected, Arrow Up moves it one grid step (1 Hz).
  await canvas(page).press('ArrowUp');
  await expect(page.getByLabel('Segment 1 to (Hz)', { exact: true })).toHaveValue('21');
  await canvas(page).press('Control+z');
  await expect(page.getByLabel('Segment 1 to (Hz)', { exact: true })).toHaveValue('20');
  await expectPreviewMatchesTable(page);

  // The shape tool replaces 60–90 s (inside the 6→12 Hz ramp, up to the starter sine) with a sine.
  const shape = page.getByRole('form', { name: 'Insert a shape' });
  await shape.getByRole('radio', { name: 'sine' }).check();
  await shape.getByLabel('from (s)').fill('60');
  await shape.getByLabel('to (s)').fill('90');
  await shape.getByLabel('mean (Hz)').fill('8');
  await shape.getByLabel('depth (Hz)').fill('4');
  await shape.getByLabel('frequency (Hz)').fill('0.25');
  await shape.getByLabel('phase (°)').fill('30');
  await shape.getByRole('button', { name: 'Replace span with sine' }).click();
  await expect(segmentKinds(page)).toHaveCount(6);
  rows = await readTable(page);
  expect(rows).toHaveLength(6);
  expect(rows[3]).toMatchObject({ kind: 'ramp', fromHz: 6 });
  expect(rows[3].durationS).toBeCloseTo(60 - 45, 0);
  expect(rows[4]).toEqual({ kind: 'sine', durationS: 30, meanHz: 8, depthHz: 4, freqHz: 0.25, phaseDeg: 30 });
  expect(rows[5]).toMatchObject({ kind: 'sine', durationS: 90, meanHz: 10, depthHz: 8 });
  // 7.5 cycles with a 30° phase: the sine adds 240 + 4/(2π·0.25)·2·cos 30° ≈ 244.41 pulses,
  // checked with the ramp cut at 60 s in closed form.
  await expectPreviewMatchesTable(page);

  // The preview follows the trial count and the seed.
  const preview = page.getByRole('region', { name: 'Preview', exact: true });
  await preview.getByRole('spinbutton', { name: 'Trials' }).fill('3');
  await expect(async () => {
    await previewSettled(page);
    await expect(previewNumber(page, 'Realized pulses')).toContainText('over 3 trials', { timeout: 1000 });
  }).toPass({ timeout: 30_000 });
  const seedField = page.getByRole('textbox', { name: 'Seed', exact: true });
  const oldSeed = await seedField.inputValue();
  await page.getByRole('button', { name: 'New seed' }).click();
  await expect(seedField).not.toHaveValue(oldSeed);
  const newSeed = await seedField.inputValue();
  await expect(preview.getByText(newSeed, { exact: true })).toBeVisible();
  await previewSettled(page);

  // Save, reload: the saved envelope and seed come back.
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByText('Saved.', { exact: true })).toBeVisible();
  const saved = await readTable(page);
  await page.reload();
  await expect(segmentKinds(page)).toHaveCount(6);
  expect(await readTable(page)).toEqual(saved);
  await expect(seedField).toHaveValue(newSeed);

  // Rename through the details form.
  await page.getByLabel('Name', { exact: true }).fill(stamp);
  await page.getByLabel('Description', { exact: true }).fill('Drawn by the browser test');
  await page.getByRole('button', { name: 'Save details' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Saved.' })).toBeVisible();
  await page.reload();
  await expect(page.getByRole('heading', { level: 1 })).toHaveText(stamp);

  // Duplicate: a new envelope with the same segments.
  const originalUrl = page.url();
  await page.getByRole('button', { name: 'Duplicate' }).click();
  await expect(page.getByRole('heading', { level: 1 })).toHaveText(`${stamp} (copy)`);
  expect(page.url()).not.toBe(originalUrl);
  const copyUrl = page.url();
  await expect(segmentKinds(page)).toHaveCount(6);
  expect(await readTable(page)).toEqual(saved);

  // Delete the copy; the list no longer has it; Undo brings it back.
  await page.getByRole('button', { name: 'Delete' }).click();
  await expect(page).toHaveURL(/\/envelopes\?deleted=/);
  await expect(page.getByRole('status').filter({ hasText: 'The envelope was deleted.' })).toBeVisible();
  await expect(page.getByRole('link', { name: `${stamp} (copy)` })).toHaveCount(0);
  await expect(page.getByRole('link', { name: stamp, exact: true })).toBeVisible();
  await page.getByRole('button', { name: 'Undo' }).click();
  await expect(page).toHaveURL(copyUrl);
  await expect(page.getByRole('heading', { level: 1 })).toHaveText(`${stamp} (copy)`);

  // Search finds both; sorting by name flips their order.
  await page.goto('/envelopes');
  await page.getByLabel('Search envelopes').fill(stamp);
  await page.getByRole('button', { name: 'Search' }).click();
  const names = page.getByRole('table').getByRole('link', { name: new RegExp(stamp) });
  await expect(names).toHaveCount(2);
  const nameHeader = page.getByRole('columnheader', { name: /^Name/ });
  await nameHeader.getByRole('link').click();
  await expect(nameHeader).toHaveAttribute('aria-sort', 'ascending');
  await expect(names).toHaveText([stamp, `${stamp} (copy)`]);
  await nameHeader.getByRole('link').click();
  await expect(nameHeader).toHaveAttribute('aria-sort', 'descending');
  await expect(names).toHaveText([`${stamp} (copy)`, stamp]);
  await page.getByLabel('Search envelopes').fill(`${stamp} nothing like this`);
  await page.getByRole('button', { name: 'Search' }).click();
  await expect(page.getByText(/No envelope matches/)).toBeVisible();
});

test('a CSV with one bad line is refused with its line number and reason; a good one replaces the envelope', async ({ page }) => {
  await signInWithPassword(page, DEMO.experimenter);
  await newOpticalEnvelope(page);

  await page.getByRole('button', { name: 'Import CSV…' }).click();
  const dialog = page.getByRole('dialog', { name: 'Import an envelope from CSV' });
  await expect(dialog).toBeVisible();
  // Line 1 is the header; line 4 has a decimal comma in its rate.
  const bad = 'time_s,rate_hz\n0,5\n10,10\n20,7,5\n30,15\n';
  await dialog.getByLabel('CSV file').setInputFiles({ name: 'trace-bad.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
  await expect(dialog.getByText('trace-bad.csv cannot be used as it is')).toBeVisible();
  await expect(dialog.getByRole('listitem')).toHaveText([/^line 4: Expected 2 fields \(time_s,rate_hz\), found 3 \(a decimal comma\? use a decimal point\)\.$/]);
  await expect(dialog.getByRole('button', { name: 'Replace the envelope' })).toBeDisabled();

  const good = 'time_s,rate_hz\n0,5\n10,10\n20,7.5\n30,15\n';
  await dialog.getByLabel('CSV file').setInputFiles({ name: 'trace.csv', mimeType: 'text/csv', buffer: Buffer.from(good) });
  await expect(dialog.getByText(/Read 4 rows after a header row/)).toBeVisible();
  await expect(dialog.getByText(/The new envelope: 3 segments over 30\.000 s/)).toBeVisible();
  await dialog.getByRole('button', { name: 'Replace the envelope' }).click();
  await expect(dialog).toBeHidden();

  await expect(segmentKinds(page)).toHaveCount(3);
  expect(await readTable(page)).toEqual([
    { kind: 'ramp', durationS: 10, fromHz: 5, toHz: 10 },
    { kind: 'ramp', durationS: 10, fromHz: 10, toHz: 7.5 },
    { kind: 'ramp', durationS: 10, fromHz: 7.5, toHz: 15 },
  ]);
  // Trapezoids: 10·(5+10)/2 + 10·(10+7.5)/2 + 10·(7.5+15)/2 = 75 + 87.5 + 112.5 = 275 pulses per trial.
  await expectPreviewMatchesTable(page);
  await expect(previewNumber(page, 'Expected pulses / trial')).toHaveText(/^275\.0/);

  // The import is one undo step.
  await page.getByRole('button', { name: 'Undo' }).click();
  await expect(segmentKinds(page)).toHaveCount(STARTER.segments);
  await expect(page.getByLabel('Segment 3 kind', { exact: true })).toHaveValue('sine');
});

test('a safety officer sees an envelope read-only, without Save or editing tools', async ({ page, browser }) => {
  // The experimenter drafts one in a context of their own.
  const drafting = await browser.newContext();
  const author = await drafting.newPage();
  await signInWithPassword(author, DEMO.experimenter);
  const id = await newOpticalEnvelope(author);
  await drafting.close();

  await signInWithPassword(page, DEMO.officer);
  await page.goto('/envelopes');
  await expect(page.getByRole('button', { name: 'New optical envelope' })).toHaveCount(0);
  await page.goto(`/envelopes/${id}`);
  await expect(canvas(page)).toBeVisible();
  await expect(page.getByText('Read-only', { exact: true })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Save', exact: true })).toHaveCount(0);
  for (const name of ['Duplicate', 'Delete', 'Save details', 'Undo', 'Import CSV…', 'New seed']) {
    const button = page.getByRole('button', { name, exact: true });
    expect(await button.count() === 0 || (await button.isDisabled())).toBe(true);
  }
  await expect(page.getByRole('form', { name: 'Insert a shape' })).toHaveCount(0);
  await expect(page.getByLabel('Name', { exact: true })).toBeDisabled();
  await expect(page.getByLabel('Segment 1 to (Hz)', { exact: true })).not.toBeEditable();
  await expect(page.getByLabel('Segment 1 kind', { exact: true })).toBeDisabled();

  // A click on the canvas adds nothing; the Delete key says why.
  const p = await pointOnCanvas(page, startView, 15, 20);
  await page.mouse.click(p.x, p.y);
  await canvas(page).press('Delete');
  await expect(page.getByRole('status').filter({ hasText: 'This envelope is read-only.' })).toBeVisible();
  await expect(segmentKinds(page)).toHaveCount(STARTER.segments);

  // The preview still works for reading.
  await previewSettled(page);
  await expect(previewNumber(page, 'Expected pulses / trial')).toHaveText(/^1830\.0/);
});
