import { expect, test, type Page } from '@playwright/test';
import { checked, openApp, shot } from './helpers';

const doc = (page: Page) => page.evaluate(() => window.__linewright!.doc());

/** Pastes text into the focused schedule as the clipboard would (a paste event carrying text/plain). */
async function pasteInto(page: Page, testId: string, text: string): Promise<void> {
  await page.getByTestId(testId).evaluate((el, t) => {
    const dt = new DataTransfer();
    dt.setData('text/plain', t);
    el.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
  }, text);
}

test('paste ten rows copied from a spreadsheet into the conductor schedule: previewed, then one undoable import, laid out', async ({ page }, info) => {
  await openApp(page);
  await page.getByTestId('cmd-new').click();
  await expect(page.locator('.react-flow__node')).toHaveCount(0);
  await page.getByTestId('schedule-tab-conductors').click();
  const grid = page.getByTestId('schedule-conductors');
  await grid.focus();
  // Ten rows as a spreadsheet copies them: tab between cells, no header row (the schedule's column order).
  const rows = Array.from({ length: 10 }, (_, i) => ['MSB', `LP-${i + 1}`, i % 2 ? '3/0' : '1/0', '1', 'Cu', String(60 + 5 * i), 'THHN', i % 2 ? '200' : '150'].join('\t'));
  await pasteInto(page, 'schedule-conductors', rows.join('\r\n') + '\r\n');
  const dialog = page.getByTestId('import-dialog');
  await expect(dialog).toBeVisible();
  await expect(page.getByTestId('import-summary')).toContainText('10 rows: 10 to add, 0 to update, 0 with problems');
  await expect(page.getByTestId('import-preview').locator('tbody tr')).toHaveCount(10);
  await shot(page, info, 'paste-preview');
  await page.getByTestId('import-apply').click();
  await expect(dialog).toBeHidden();
  await expect(page.getByTestId('history-hint')).toContainText('Import 10 rows');
  await checked(page);
  const d = await doc(page);
  expect(d.conductors).toHaveLength(10);
  expect(d.conductors[9]).toMatchObject({ size: '3/0', lengthFt: 105, material: 'cu', insulation: 'THHN' });
  // Laid out: every piece has a place, and no two share one.
  const places = d.nodes.map((n) => `${n.position?.x},${n.position?.y}`);
  expect(d.nodes.every((n) => n.position)).toBe(true);
  expect(new Set(places).size).toBe(places.length);
  await expect(page.getByTestId('schedule-tab-conductors')).toContainText('(10)');
  await expect(page.getByTestId('row-conductors-F-LP-1')).toBeVisible();
  await shot(page, info, 'paste-imported');
  // One step back takes the whole import away.
  await page.getByTestId('cmd-undo').click();
  await expect(page.getByTestId('schedule-tab-conductors')).toContainText('(0)');
  expect((await doc(page)).nodes).toHaveLength(0);
});

test('import a CSV schedule: two bad cells named with the fix, corrected in the preview, then imported', async ({ page }, info) => {
  await openApp(page);
  await checked(page);
  const before = await doc(page);
  const csv = [
    'Feeder Tag,Fed From,To,Wire Size,Sets,Material,Length (ft),Insulation,Breaker (A)',
    'F-101,Level 1 riser tap box,Imported panel A,4/0,1,Copper,120,THWN-2,225',
    'F-102,Level 1 riser tap box,Imported panel B,5,1,Copper,80,THHN,200',
    'F-103,Imported panel A,Imported panel C,1/0,1,Al,about ninety,XHHW-2,150',
  ].join('\r\n');
  await page.getByTestId('import-file-input').setInputFiles({ name: 'feeders.csv', mimeType: 'text/csv', buffer: Buffer.from(csv, 'utf8') });
  const dialog = page.getByTestId('import-dialog');
  await expect(dialog).toBeVisible();
  await expect(page.getByTestId('import-problem-0')).toContainText('Row 3, column "Wire Size" ("5"): expected a conductor size of NEC Table 310.16');
  await expect(page.getByTestId('import-problem-1')).toContainText('Row 4, column "Length (ft)" ("about ninety"): expected a length in feet');
  await expect(page.getByTestId('import-problem-1')).toContainText('Fix: write the number of feet');
  await expect(page.getByTestId('import-apply')).toBeDisabled();
  await expect(page.getByTestId('import-preview').locator('td.is-bad-cell')).toHaveCount(2);
  await shot(page, info, 'import-two-bad-cells');
  // Nothing changed yet.
  expect((await doc(page)).conductors).toHaveLength(before.conductors.length);

  const size = page.getByTestId('import-fix-3-3');
  await size.fill('4');
  await size.press('Enter');
  await expect(page.getByTestId('import-problem-1')).toBeHidden();
  const length = page.getByTestId('import-fix-4-6');
  await length.fill('90');
  await length.press('Enter');
  await expect(page.getByTestId('import-problem-0')).toBeHidden();
  await expect(page.getByTestId('import-summary')).toContainText('3 rows: 3 to add, 0 to update, 0 with problems');
  await page.getByTestId('import-apply').click();
  await expect(dialog).toBeHidden();
  await expect(page.getByTestId('history-hint')).toContainText('Import 3 rows from feeders.csv');
  await checked(page);
  const after = await doc(page);
  expect(after.conductors).toHaveLength(before.conductors.length + 3);
  expect(after.conductors.find((c) => c.id === 'F-102')).toMatchObject({ size: '4', lengthFt: 80 });
  expect(after.conductors.find((c) => c.id === 'F-103')).toMatchObject({ size: '1/0', material: 'al', lengthFt: 90, insulation: 'XHHW-2' });
  // Joined to the drawing's own tap box, found by its name; the current drawing is all still there.
  expect(after.conductors.find((c) => c.id === 'F-101')!.from).not.toBe('Level 1 riser tap box');
  for (const c of before.conductors) expect(after.conductors.some((x) => x.id === c.id)).toBe(true);
  await shot(page, info, 'import-done');
});

test('edit a cell of the conductor schedule with the keyboard, then undo it; a row selects its conductor', async ({ page }, info) => {
  await openApp(page);
  await checked(page);
  await page.getByTestId('schedule-tab-conductors').click();
  const grid = page.getByTestId('schedule-conductors');
  await expect(grid).toBeVisible();
  // Find F-R2 with the filter.
  await page.getByTestId('schedule-filter').fill('F-R2');
  await expect(grid.getByRole('row')).toHaveCount(2);
  await grid.getByTestId('row-conductors-F-R2').locator('[data-col="size"]').click();
  // The row is the conductor selected on the drawing (and in the details panel).
  await expect(page.getByTestId('details').locator('h2').first()).toHaveText('Conductor');
  await expect(grid.getByTestId('row-conductors-F-R2')).toHaveAttribute('aria-selected', 'true');
  await expect(page.getByTestId('schedule-error')).toBeHidden();
  // Typing over the cell edits it; a size that Table 310.16 does not have stays with the reason.
  await page.keyboard.type('5');
  const editor = page.getByTestId('schedule-editor');
  await expect(editor).toBeFocused();
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('schedule-error')).toContainText('F-R2, Size');
  await editor.fill('500');
  await page.keyboard.press('Enter');
  await expect(editor).toBeHidden();
  await expect(grid.getByTestId('row-conductors-F-R2').locator('[data-col="size"]')).toHaveText('500');
  await expect(page.getByTestId('history-hint')).toContainText('Set size of F-R2');
  await checked(page);
  expect((await doc(page)).conductors.find((c) => c.id === 'F-R2')!.size).toBe('500');
  // Arrows and Tab move; Escape leaves a cell unchanged.
  await page.keyboard.press('ArrowRight');
  await page.keyboard.press('Enter');
  await expect(editor).toBeFocused();
  await page.keyboard.press('Escape');
  await expect(editor).toBeHidden();
  await expect(grid).toBeFocused();
  await shot(page, info, 'schedule-edited');
  await page.getByTestId('cmd-undo').click();
  await expect(grid.getByTestId('row-conductors-F-R2').locator('[data-col="size"]')).toHaveText('350');
  await checked(page);
  expect((await doc(page)).conductors.find((c) => c.id === 'F-R2')!.size).toBe('350');
});

test('at 1440 px the study layer switches do not cover the canvas hint bar', async ({ page }, info) => {
  await page.setViewportSize({ width: 1440, height: 900 });
  await openApp(page);
  const a = await page.locator('.lw-drawing-tools').boundingBox();
  const b = await page.getByTestId('study-layers').boundingBox();
  expect(a && b).toBeTruthy();
  const overlap = Math.min(a!.x + a!.width, b!.x + b!.width) - Math.max(a!.x, b!.x) > 0 && Math.min(a!.y + a!.height, b!.y + b!.height) - Math.max(a!.y, b!.y) > 0;
  expect(overlap).toBe(false);
  await shot(page, info, 'hint-bar-1440');
});

test('several conductors selected: the details panel edits the fields they share in one undoable step, mixed values shown as such', async ({ page }, info) => {
  await openApp(page);
  await checked(page);
  await page.evaluate(() => window.__linewright!.select({ conductors: ['F-R2', 'F-R3', 'TAP-L1'] }));
  const form = page.getByTestId('multi-form');
  await expect(form).toBeVisible();
  // F-R2 and F-R3 are 350 kcmil, TAP-L1 is 1/0: the size is mixed; all three are copper.
  await expect(page.getByTestId('multi-size')).toHaveValue('\u0000mixed');
  await expect(page.getByTestId('multi-material')).toHaveValue('cu');
  await expect(page.getByTestId('multi-lengthFt')).toHaveAttribute('placeholder', 'mixed');
  await page.getByTestId('multi-ambientC').fill('40');
  await page.getByTestId('multi-ambientC').press('Enter');
  await expect(page.getByTestId('history-hint')).toContainText('Set ambient of 3 conductors');
  await checked(page);
  const after = await doc(page);
  expect(['F-R2', 'F-R3', 'TAP-L1'].map((id) => after.conductors.find((c) => c.id === id)!.ambientC)).toEqual([40, 40, 40]);
  await shot(page, info, 'multi-edit');
  // A value one of them cannot take changes none of them, and says which.
  await page.getByTestId('multi-parallelSets').fill('0');
  await page.getByTestId('multi-parallelSets').press('Enter');
  await expect(page.getByTestId('error-multi-parallelSets')).toContainText('F-R2');
  await page.getByTestId('cmd-undo').click();
  await expect(page.getByTestId('history-hint')).not.toContainText('Set ambient');
  await checked(page);
  const back = await doc(page);
  expect(['F-R2', 'F-R3', 'TAP-L1'].map((id) => back.conductors.find((c) => c.id === id)!.ambientC)).toEqual([30, 30, 30]);
});
