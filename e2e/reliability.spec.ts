import { readFileSync } from 'node:fs';
import { expect, test, type Page } from '@playwright/test';
import { checked, openApp, shot } from './helpers';

/**
 * No edit is lost and hostile text stays inert, in real Chromium: a reload 50 ms after an edit, leaving
 * the page and closing the tab keep the edit (and its undo step); two tabs on one drawing warn instead of
 * overwriting each other; storage that never answers still starts the editor; a right-to-left override in
 * a label is shown isolated. Linewright's own requirements (common practice for an editor), no outside source.
 */

async function lengthOf(page: Page, id: string): Promise<number | undefined> {
  return page.evaluate((c) => window.__linewright!.doc().conductors.find((x) => x.id === c)?.lengthFt, id);
}

async function firstConductor(page: Page): Promise<{ id: string; lengthFt: number }> {
  return page.evaluate(() => {
    const c = window.__linewright!.doc().conductors.find((x) => typeof x.lengthFt === 'number')!;
    return { id: c.id, lengthFt: c.lengthFt! };
  });
}

async function ready(page: Page): Promise<void> {
  await page.waitForFunction(() => !!window.__linewright);
  await checked(page);
}

test('an edit followed by a reload 50 ms later is kept, and Undo still takes it back after the reload', async ({ page }, info) => {
  await openApp(page);
  await ready(page);
  const c = await firstConductor(page);
  for (const [n, lengthFt] of [[1, 123], [2, 124], [3, 125]] as const) {
    await page.evaluate(([id, len]) => void window.__linewright!.setConductorLength(id, len), [c.id, lengthFt] as const);
    await page.waitForTimeout(50);
    await page.reload();
    await ready(page);
    expect(await lengthOf(page, c.id), `reload ${n}`).toBe(lengthFt);
  }
  await shot(page, info, 'reloaded');
  // The undo history came back with the drawing: three steps, newest first.
  await page.getByTestId('cmd-undo').click();
  await checked(page);
  expect(await lengthOf(page, c.id)).toBe(124);
  await page.getByTestId('cmd-undo').click();
  await page.getByTestId('cmd-undo').click();
  await checked(page);
  expect(await lengthOf(page, c.id)).toBe(c.lengthFt);
});

test('leaving the page or closing the tab right after an edit keeps it', async ({ page, context }) => {
  await openApp(page);
  await ready(page);
  const c = await firstConductor(page);
  await page.evaluate((id) => void window.__linewright!.setConductorLength(id, 211), c.id);
  await page.goto('about:blank');
  await page.goto('/');
  await ready(page);
  expect(await lengthOf(page, c.id)).toBe(211);

  await page.evaluate((id) => void window.__linewright!.setConductorLength(id, 212), c.id);
  await page.close({ runBeforeUnload: true });
  const next = await context.newPage();
  await next.goto('/');
  await ready(next);
  expect(await lengthOf(next, c.id)).toBe(212);
});

test('two tabs on the same drawing: the later save is announced, both versions are offered, nothing is overwritten', async ({ page, context }, info) => {
  await openApp(page);
  await ready(page);
  const c = await firstConductor(page);
  await page.evaluate((id) => void window.__linewright!.setConductorLength(id, 301), c.id);
  await page.waitForFunction(() => window.__linewright!.stats().saves > 0 && window.__linewright!.stats().saveIdle);

  const second = await context.newPage();
  await second.goto('/');
  await ready(second);
  expect(await lengthOf(second, c.id)).toBe(301);
  await second.evaluate((id) => void window.__linewright!.setConductorLength(id, 302), c.id);
  await second.waitForFunction(() => window.__linewright!.stats().saveIdle);

  const notice = page.getByTestId('other-tab-notice');
  await expect(notice).toBeVisible();
  await expect(notice).toContainText('Another tab saved a later version of this drawing');
  await shot(page, info, 'other-tab-notice');
  expect(await lengthOf(page, c.id), 'the first tab keeps its own drawing until asked').toBe(301);

  // Opening reads the other tab's copy from storage (asynchronous): the notice closes once it is open.
  await page.getByTestId('other-tab-open').click();
  await expect(notice).toBeHidden();
  await checked(page);
  expect(await lengthOf(page, c.id)).toBe(302);
  await page.getByTestId('cmd-undo').click();
  await checked(page);
  expect(await lengthOf(page, c.id), 'Undo returns to this tab’s version').toBe(301);

  // The first tab's later save does not overwrite the second tab's drawing either; the second is told.
  await page.evaluate((id) => void window.__linewright!.setConductorLength(id, 303), c.id);
  await expect(second.getByTestId('other-tab-notice')).toBeVisible();
  expect(await lengthOf(second, c.id)).toBe(302);
  await second.reload();
  await ready(second);
  expect(await lengthOf(second, c.id), 'a reload of the second tab finds its own drawing').toBe(302);
});

test('browser storage that never answers still starts the editor on the demo, with a notice', async ({ page }, info) => {
  await page.addInitScript(() => {
    // An IndexedDB open request that never fires success, error or blocked.
    Object.defineProperty(IDBFactory.prototype, 'open', { value: () => ({}) as IDBOpenDBRequest, configurable: true });
  });
  await openApp(page);
  await ready(page);
  await expect(page.getByTestId('notice').filter({ hasText: 'did not answer' })).toBeVisible();
  expect(await page.evaluate(() => window.__linewright!.doc().conductors.length)).toBeGreaterThan(0);
  await shot(page, info, 'storage-timeout');
  // Edits are still kept across a reload by the copy in this tab.
  const c = await firstConductor(page);
  await page.evaluate((id) => void window.__linewright!.setConductorLength(id, 99), c.id);
  await page.reload();
  await ready(page);
  expect(await lengthOf(page, c.id)).toBe(99);
});

test('a right-to-left override in a label is shown isolated in the findings: the words after it stay in order', async ({ page }, info) => {
  await openApp(page);
  await ready(page);
  const sample = JSON.parse(readFileSync(new URL('../samples/demo-clinic.json', import.meta.url), 'utf8')) as {
    conductors: { id: string; label?: string }[];
  };
  const hostile = '25 ft tap to \u202ELP-3 evil';
  sample.conductors.find((x) => x.id === 'TAP-L3')!.label = hostile;
  await page.evaluate((text) => window.__linewright!.open(text, 'rtl.json'), JSON.stringify(sample));
  await checked(page);
  const iso = page.getByTestId('isolated-text').filter({ hasText: 'LP-3 evil' }).first();
  await expect(iso).toBeAttached();
  expect(await iso.evaluate((e) => e.tagName)).toBe('BDI');
  await iso.scrollIntoViewIfNeeded();
  await shot(page, info, 'rtl-isolated');
  // Rendering check: the first character after the isolate sits to its right, as in a left-to-right sentence.
  const geometry = await iso.evaluate((e) => {
    const after = e.nextSibling;
    if (!after || after.nodeType !== Node.TEXT_NODE || !after.textContent) return null;
    const r = document.createRange();
    r.setStart(after, 1);
    r.setEnd(after, 2);
    const box = e.getBoundingClientRect();
    const next = r.getBoundingClientRect();
    return { isoRight: box.right, isoTop: box.top, nextLeft: next.left, nextTop: next.top, text: after.textContent.slice(0, 12) };
  });
  expect(geometry, 'text follows the isolated label').not.toBeNull();
  if (geometry!.nextTop - geometry!.isoTop < 4) expect(geometry!.nextLeft).toBeGreaterThanOrEqual(geometry!.isoRight - 1);
});
