import { expect, test } from '@playwright/test';
import { checked, openApp, shot } from './helpers';

test('build a riser with the keyboard alone', async ({ page }, info) => {
  await page.setViewportSize({ width: 1366, height: 768 });
  await openApp(page);
  await page.getByTestId('cmd-new').click();
  await expect(page.locator('.react-flow__node')).toHaveCount(0);
  await page.locator('body').focus();
  // Keys follow the palette: 1 utility, 3 bus, 4 breaker, 8 transformer, 9 load; Alt+Up walks to the supply.
  // Each new piece is on screen the moment it is placed (the view follows it).
  const press = async (k: string) => {
    await page.keyboard.press(k);
    const last = await page.evaluate(() => window.__linewright!.doc().nodes.at(-1)!.id);
    await expect(page.getByTestId(`node-${last}`)).toBeInViewport();
  };
  for (const k of ['1', '4', '3', '4', '9']) await press(k);
  await page.keyboard.press('Alt+ArrowUp');
  await page.keyboard.press('Alt+ArrowUp');
  for (const k of ['4', '8', '4', '3']) await press(k);
  await checked(page);
  const doc = await page.evaluate(() => window.__linewright!.doc());
  expect(doc.nodes.map((n) => n.kind)).toEqual(['utility', 'breaker', 'bus', 'breaker', 'load', 'breaker', 'transformer', 'breaker', 'bus']);
  // Utility → main: conductor; main → bus, bus → feeders: bus links; feeder → transformer → secondary breaker: conductors;
  // secondary breaker → panel bus: bus link (common practice for a panel with a main breaker).
  expect(doc.conductors).toHaveLength(4);
  expect(doc.busLinks).toHaveLength(4);
  // The piece just added is brought into view (a tall riser may scroll its top out of a 768 px window).
  await expect(page.getByTestId(`node-${doc.nodes[doc.nodes.length - 1]!.id}`)).toBeInViewport();
  await shot(page, info, 'keyboard-riser');
});

test('insert a breaker into a conductor: lengths split as asked, nothing overlaps', async ({ page }, info) => {
  await openApp(page);
  await checked(page);
  const doc = await page.evaluate(() => window.__linewright!.doc());
  const c = doc.conductors.find((x) => x.lengthFt !== undefined && x.lengthFt >= 20)!;
  const label = page.getByTestId(`conductor-label-${c.id}`);
  await page.evaluate((id) => window.__linewright!.select({ conductors: [id] }), c.id);
  await expect(page.getByTestId('insert-tools')).toBeVisible();
  await page.getByTestId('insert-at').fill('5');
  await page.getByTestId('insert-breaker').click();
  await checked(page);
  const after = await page.evaluate(() => window.__linewright!.doc());
  const first = after.conductors.find((x) => x.id === c.id)!;
  const second = after.conductors.find((x) => x.from === first.to)!;
  expect(first.lengthFt).toBe(5);
  expect(second.lengthFt).toBe(Math.round((c.lengthFt! - 5) * 10) / 10);
  expect(second.to).toBe(c.to);
  expect(after.nodes.find((n) => n.id === first.to)!.kind).toBe('breaker');
  await expect(label).toHaveCount(1);
  await shot(page, info, 'breaker-inserted');
});
