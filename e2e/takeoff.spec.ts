import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { checked, openApp, shot } from './helpers';

// The takeoff of the demo (samples/demo-clinic.json): the same numbers the CLI prints, from the same core.
test('the takeoff view shows grouped, sortable tables with totals and downloads XLSX and CSV', async ({ page }, info) => {
  await openApp(page);
  await checked(page);
  await page.getByTestId('cmd-takeoff').click();
  const view = page.getByTestId('takeoff-view');
  await expect(view).toBeVisible();
  await expect(view.getByTestId('takeoff-table-wire')).toBeVisible();
  await expect(view.getByTestId('takeoff-caution')).toContainText('qualified person');
  // Wire totals: 4931 ft for the demo (phase 3294 + neutral 384 + EGC and supply-side bonding jumpers 1253; see `linewright takeoff samples/demo-clinic.json`).
  await expect(view.getByTestId('takeoff-total-wire-totalFt')).toHaveText('4931');
  await shot(page, info, 'takeoff');

  // Sorting by total feet, descending on the second click: 12 AWG (1395 ft) comes first.
  await view.getByTestId('takeoff-sort-wire-totalFt').click();
  await view.getByTestId('takeoff-sort-wire-totalFt').click();
  await expect(view.getByTestId('takeoff-table-wire').locator('tbody tr').first()).toContainText('12 AWG');

  const [xlsx] = await Promise.all([page.waitForEvent('download'), view.getByTestId('takeoff-xlsx').click()]);
  expect(xlsx.suggestedFilename()).toMatch(/\.takeoff\.xlsx$/);
  // An XLSX workbook is a zip package (ECMA-376 Part 2): local file header 'PK\x03\x04'.
  const bytes = readFileSync((await xlsx.path())!);
  expect([...bytes.subarray(0, 4)]).toEqual([0x50, 0x4b, 0x03, 0x04]);

  const [csv] = await Promise.all([page.waitForEvent('download'), view.getByTestId('takeoff-csv').click()]);
  expect(readFileSync((await csv.path())!, 'utf8')).toContain('Wire by size, material and insulation (ft)');

  await view.getByTestId('takeoff-close').click();
  await expect(view).toBeHidden();
});
