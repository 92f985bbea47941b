import { expect, test } from '@playwright/test';
import { clickNode, openApp, shot } from './helpers';

// The demo opens on samples/demo-clinic.json: a 42 kA utility at X/R 6 (its own data), so the
// utility node reads 42.00 kA; the working of the main breaker lists the source and the service conductors.
test('fault kA and voltage-drop layers switch on and off; a node shows its short-circuit working', async ({ page }, info) => {
  await openApp(page);
  await expect(page.getByTestId('layer-label-f:UTIL')).toHaveCount(0);
  await page.getByTestId('layer-fault').check();
  await expect(page.getByTestId('layer-label-f:UTIL')).toContainText('42.00 kA');
  await page.getByTestId('layer-drop').check();
  await expect(page.getByTestId('layer-label-d:SVC')).toContainText('VD');
  await shot(page, info, 'study-layers');
  await page.getByTestId('layer-fault').uncheck();
  await expect(page.getByTestId('layer-label-f:UTIL')).toHaveCount(0);
  await clickNode(page, 'MSB-MAIN');
  const working = page.getByTestId('fault-working');
  await expect(working).toContainText('Available fault current');
  await expect(working).toContainText('UTIL');
  await expect(working).toContainText('Chapter 9 Table 9');
});
