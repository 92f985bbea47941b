import { expect, test } from '@playwright/test';
import { checked, openApp, shot, verdictOf } from './helpers';

// The demo opens on samples/demo-clinic.json. TAP-L3 is a 25 ft tap of 2/0 Cu (175 A) off a
// 600 A feeder device: below one third of 600 A = 200 A (240.21(B)(2)), so no rule fits. The
// sizing assistant lists 3/0 Cu (Table 310.16, 75 °C: 200 A) and says 2/0 fails the one-third limit.
test('size this conductor: the choices, why the next smaller fails, one undoable edit', async ({ page }, info) => {
  await openApp(page);
  await checked(page);
  await expect(verdictOf(page, 'TAP-L3')).toHaveAttribute('data-verdict', 'unprotected');
  await page.evaluate(() => window.__linewright!.select({ conductors: ['TAP-L3'] }));
  const size = page.getByTestId('size-conductor');
  await expect(size).toBeVisible();
  await size.click();

  // The search re-checks the drawing with each choice: wait for its result, however loaded the machine.
  const result = page.getByTestId('sizing-result');
  await expect(result).toBeVisible({ timeout: 60_000 });
  await expect(page.getByTestId('sizing-present')).toHaveAttribute('data-passes', 'no');
  await expect(page.getByTestId('sizing-basis')).toContainText('Relative cost, not a price');
  const cu = page.locator('[data-testid="sizing-candidate"][data-size="3/0"][data-material="cu"][data-sets="1"]');
  await expect(cu).toBeVisible();
  await expect(cu).toContainText('200 A');
  await expect(cu.getByTestId('sizing-smaller-fails')).toContainText('one third of the 600 A feeder device');
  await shot(page, info, 'sizing-choices');

  const before = await page.evaluate(() => window.__linewright!.docVersion());
  await cu.getByTestId('sizing-apply').click();
  await page.waitForFunction((v) => window.__linewright!.docVersion() > v, before);
  await checked(page);
  await expect(verdictOf(page, 'TAP-L3')).toHaveAttribute('data-verdict', 'tap-25ft');
  const after = await page.evaluate(() => window.__linewright!.doc().conductors.find((c) => c.id === 'TAP-L3')!);
  expect([after.size, after.material, after.parallelSets]).toEqual(['3/0', 'cu', 1]);
  // The result belonged to the drawing before the edit: it gives way to the button again.
  await expect(result).toBeHidden();
  await expect(size).toBeVisible();
  await shot(page, info, 'sizing-applied');

  // One edit: one undo takes it all back.
  await page.getByTestId('cmd-undo').click();
  await checked(page);
  await expect(verdictOf(page, 'TAP-L3')).toHaveAttribute('data-verdict', 'unprotected');
  const undone = await page.evaluate(() => window.__linewright!.doc().conductors.find((c) => c.id === 'TAP-L3')!.size);
  expect(undone).toBe('2/0');
});
