import { expect, test, type Page } from '@playwright/test';
import { checked, clickNode, dragPort, nodeIdsOfKind, openApp, setField, shot, verdictOf } from './helpers';

/** Drops an equipment kind from the palette at (x, y) of the drawing area (the wire lands on x). */
async function place(page: Page, kind: string, x: number, y: number): Promise<string> {
  const before = await nodeIdsOfKind(page, kind);
  await page.getByTestId(`palette-${kind}`).dragTo(page.getByTestId('canvas'), { targetPosition: { x, y } });
  const after = await nodeIdsOfKind(page, kind);
  const id = after.find((i) => !before.includes(i));
  expect(id, `a new ${kind} on the drawing`).toBeTruthy();
  return id!;
}

async function selectNode(page: Page, id: string): Promise<void> {
  await clickNode(page, id);
  await expect(page.getByTestId('details')).toBeVisible();
}

async function conductorInto(page: Page, toNodeId: string): Promise<string> {
  const id = await page.evaluate((to) => window.__linewright!.doc().conductors.find((c) => c.to === to)?.id, toNodeId);
  expect(id, `a conductor into ${toNodeId}`).toBeTruthy();
  return id!;
}

// Tap rules used below (NFPA 70-2023 240.21(B)(1) and (B)(2)); figures from NFPA 70-2023 Table 310.16 (75 °C column):
// 3/0 Cu = 200 A. From a 600 A feeder device: a 10-ft tap needs ampacity ≥ the 200 A device it ends in (200 ≥ 200),
// a 25-ft tap needs ≥ 600/3 = 200 A and one device ≤ its ampacity (200 ≤ 200); past 25 ft no feeder-tap rule
// applies indoors, so the tap is unprotected.
test('draw a feeder, a splice and a tap to a panelboard; lengthen the tap; fix, undo, redo, reload', async ({ page }, info) => {
  await openApp(page);

  await test.step('start an empty drawing', async () => {
    await page.getByTestId('cmd-new').click();
    await expect(page.locator('.react-flow__node')).toHaveCount(0);
    await shot(page, info, 'empty');
  });

  const ids = await test.step('place equipment from the palette', async () => {
    const utility = await place(page, 'utility', 300, 90);
    const feeder = await place(page, 'breaker', 300, 210);
    const splice = await place(page, 'splice', 300, 330);
    const main = await place(page, 'breaker', 300, 460);
    const panel = await place(page, 'bus', 300, 590);
    await expect(page.locator('.react-flow__node')).toHaveCount(5);
    await shot(page, info, 'placed');
    return { utility, feeder, splice, main, panel };
  });

  await test.step('set the device ratings in the details panel', async () => {
    await selectNode(page, ids.feeder);
    await setField(page, 'label', 'Feeder CB');
    await setField(page, 'ratingA', '600');
    await selectNode(page, ids.main);
    await setField(page, 'label', 'Panel main');
    await setField(page, 'ratingA', '200');
    await expect(page.getByTestId(`node-${ids.main}`)).toContainText('200 A breaker');
  });

  const tap = await test.step('connect with conductors and a bus link', async () => {
    await dragPort(page, `port-${ids.utility}-load`, `port-${ids.feeder}-line`);
    const service = await conductorInto(page, ids.feeder);
    await setField(page, 'lengthFt', '20');
    await page.getByTestId('field-size').selectOption('350');
    await setField(page, 'parallelSets', '2');

    await dragPort(page, `port-${ids.feeder}-load`, `port-${ids.splice}-line`);
    await conductorInto(page, ids.splice);
    // 2 × 350 kcmil Cu at 75 °C = 2 × 310 = 620 A ≥ 600 A (NFPA 70-2023 Table 310.16, 310.10(G)).
    await page.getByTestId('field-size').selectOption('350');
    await setField(page, 'parallelSets', '2');
    await setField(page, 'lengthFt', '60');

    await dragPort(page, `port-${ids.splice}-load`, `port-${ids.main}-line`);
    const tapId = await conductorInto(page, ids.main);
    await page.getByTestId('field-size').selectOption('3/0');
    await setField(page, 'lengthFt', '8');

    // A main breaker over the bus it feeds: the drag makes a bus link, no mode needed.
    await dragPort(page, `port-${ids.main}-load`, `port-${ids.panel}-line`);
    await expect(page.locator('[data-testid^="buslink-"]')).toHaveCount(1);
    await checked(page);
    await expect(verdictOf(page, service)).toHaveAttribute('data-verdict', 'service');
    await shot(page, info, 'drawn');
    return tapId;
  });

  await test.step('an 8 ft tap of 3/0 Cu from 600 A is a 10-ft tap', async () => {
    await expect(verdictOf(page, tap)).toHaveAttribute('data-verdict', 'tap-10ft');
    await expect(verdictOf(page, tap)).toContainText('10-ft tap rule');
    await expect(verdictOf(page, tap)).toContainText('1× 3/0 Cu · 8 ft');
  });

  await test.step('lengthen past 10 ft: the 25-ft tap rule', async () => {
    await verdictOf(page, tap).click();
    await setField(page, 'lengthFt', '20');
    await checked(page);
    await expect(verdictOf(page, tap)).toHaveAttribute('data-verdict', 'tap-25ft');
    await expect(page.getByTestId('working-verdict')).toContainText('25-ft tap rule');
    await expect(page.getByTestId('working-verdict')).toContainText('240.21(B)(2)');
    await shot(page, info, 'tap-20ft');
  });

  await test.step('lengthen past 25 ft: no rule fits', async () => {
    await setField(page, 'lengthFt', '30');
    await checked(page);
    await expect(verdictOf(page, tap)).toHaveAttribute('data-verdict', 'unprotected');
    await expect(verdictOf(page, tap)).toContainText('unprotected');
    await expect(page.getByTestId('rule-trials').locator('[data-rule="tap-25ft"]')).toHaveAttribute('data-outcome', 'fails');
    await shot(page, info, 'tap-30ft');
  });

  await test.step('an invalid length stays in the field with the reason', async () => {
    await page.getByTestId('field-lengthFt').fill('-4');
    await expect(page.getByTestId('error-lengthFt')).toBeVisible();
    await page.getByTestId('field-lengthFt').press('Enter');
    const len = await page.evaluate((id) => window.__linewright!.doc().conductors.find((c) => c.id === id)!.lengthFt, tap);
    expect(len).toBe(30);
    await shot(page, info, 'invalid-length');
    await page.getByTestId('field-lengthFt').press('Escape');
  });

  const fixedVerdict = await test.step('apply a fix', async () => {
    const fix = page.getByTestId('fix-button').first();
    await expect(fix).toBeVisible();
    const label = await fix.innerText();
    await fix.click();
    await checked(page);
    await expect(page.getByTestId('history-hint')).toContainText(label);
    const v = await verdictOf(page, tap).getAttribute('data-verdict');
    expect(v).not.toBe('unprotected');
    await shot(page, info, 'fixed');
    return v!;
  });

  await test.step('undo and redo the fix', async () => {
    await page.getByTestId('canvas').click({ position: { x: 700, y: 700 } });
    await page.keyboard.press('Control+z');
    await checked(page);
    await expect(verdictOf(page, tap)).toHaveAttribute('data-verdict', 'unprotected');
    await shot(page, info, 'undone');
    await page.keyboard.press('Control+Shift+z');
    await checked(page);
    await expect(verdictOf(page, tap)).toHaveAttribute('data-verdict', fixedVerdict);
    await page.getByTestId('cmd-undo').click();
    await checked(page);
    await expect(verdictOf(page, tap)).toHaveAttribute('data-verdict', 'unprotected');
    await page.keyboard.press('Control+y');
    await checked(page);
    await expect(verdictOf(page, tap)).toHaveAttribute('data-verdict', fixedVerdict);
  });

  await test.step('reload: the drawing comes back from the autosave', async () => {
    const before = await page.evaluate(() => JSON.stringify(window.__linewright!.doc()));
    await page.waitForFunction(() => window.__linewright!.stats().saves > 0 && window.__linewright!.stats().saveIdle);
    await page.reload();
    await expect(page.getByTestId('notice').filter({ hasText: 'Restored your drawing' })).toBeVisible();
    await checked(page);
    const after = await page.evaluate(() => JSON.stringify(window.__linewright!.doc()));
    expect(after).toBe(before);
    await expect(page.locator('.react-flow__node')).toHaveCount(5);
    await expect(verdictOf(page, tap)).toHaveAttribute('data-verdict', fixedVerdict);
    await shot(page, info, 'restored');
  });
});
