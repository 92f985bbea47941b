import { readFileSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { expect, test } from '@playwright/test';
import { checked, clickNode, openApp, setField, shot, verdictOf } from './helpers';

const demo = JSON.parse(readFileSync(new URL('../samples/demo-clinic.json', import.meta.url), 'utf8')) as { conductors: { id: string }[]; nodes: unknown[] };
// Hand-derived verdicts that come with the sample (samples/demo-clinic.expected.json; NFPA 70-2023 240.4, 240.21(B)).
const expected = JSON.parse(readFileSync(new URL('../samples/demo-clinic.expected.json', import.meta.url), 'utf8')) as {
  conductors: Record<string, { verdict: string }>;
};

test('the demo opens with a verdict on every conductor', async ({ page }, info) => {
  await page.goto('/');
  await expect(page.getByTestId('caution-dialog')).toBeVisible();
  await shot(page, info, 'first-start-caution');
  await page.getByTestId('caution-ok').click();
  await expect(page.getByTestId('caution-dialog')).toBeHidden();
  // The caution stays reachable from the footer.
  await page.getByTestId('caution-open').click();
  await expect(page.getByTestId('caution-dialog')).toContainText('qualified person');
  await page.getByTestId('caution-ok').click();
  await checked(page);
  const labels = page.locator('[data-testid^="conductor-label-"]');
  await expect(labels).toHaveCount(demo.conductors.length);
  for (const [id, e] of Object.entries(expected.conductors)) {
    await expect(verdictOf(page, id), `verdict of ${id}`).toHaveAttribute('data-verdict', e.verdict);
  }
  await expect(page.getByTestId('caution-line')).toContainText('AHJ');
  await expect(page.getByTestId('check-status')).toContainText(`${demo.conductors.length} conductors checked`);
  await shot(page, info, 'demo');
});

test('the review list is keyboard navigable and frames what it names', async ({ page }, info) => {
  await openApp(page);
  await checked(page);
  await page.getByTestId('filter-info').check();
  const items = page.getByTestId('finding');
  expect(await items.count()).toBeGreaterThan(1);
  const list = page.getByTestId('review-list');
  await list.focus();
  await page.keyboard.press('End');
  await page.keyboard.press('Home');
  await page.keyboard.press('Enter');
  const first = items.first();
  await expect(first).toHaveAttribute('aria-selected', 'true');
  await expect(page.getByTestId('details')).not.toContainText('Project name');
  await page.keyboard.press('ArrowDown');
  await expect(items.nth(1)).toHaveAttribute('aria-selected', 'true');
  // Rule filter narrows the list to one rule.
  const rule = await first.getAttribute('data-rule');
  await page.getByTestId('filter-rule').selectOption(rule!);
  for (const r of await items.evaluateAll((els) => els.map((e) => e.getAttribute('data-rule')))) expect(r).toBe(rule);
  await page.getByTestId('finding').first().click();
  await expect(page.getByTestId('working-verdict')).toBeVisible();
  await page.waitForTimeout(400); // the frame animates for 250 ms
  await shot(page, info, 'finding-framed');
});

test('a broken file shows the errors and keeps the drawing', async ({ page }, info) => {
  await openApp(page);
  await checked(page);
  const before = await page.evaluate(() => JSON.stringify(window.__linewright!.doc()));
  const broken = structuredClone(demo) as { conductors: Record<string, unknown>[] };
  broken.conductors[0]!.lengthFt = -5;
  broken.conductors[1]!.size = '5/0';
  await page.getByTestId('open-file-input').setInputFiles({ name: 'broken.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(broken)) });
  const dlg = page.getByTestId('load-errors');
  await expect(dlg).toBeVisible();
  await expect(dlg).toContainText('broken.json');
  await expect(dlg).toContainText('conductors[0].lengthFt');
  await expect(dlg).toContainText('conductors[1].size');
  await expect(dlg).toContainText('Your drawing was not changed');
  await shot(page, info, 'broken-file');
  await page.getByTestId('load-errors-close').click();
  expect(await page.evaluate(() => JSON.stringify(window.__linewright!.doc()))).toBe(before);

  await page.getByTestId('open-file-input').setInputFiles({ name: 'not-json.json', mimeType: 'application/json', buffer: Buffer.from('{ "format": ') });
  await expect(dlg).toContainText('not valid JSON');
  await page.getByTestId('load-errors-close').click();
  expect(await page.evaluate(() => JSON.stringify(window.__linewright!.doc()))).toBe(before);
});

test('save the project as JSON and open it again unchanged', async ({ page }) => {
  await openApp(page);
  const [d1] = await Promise.all([page.waitForEvent('download'), page.getByTestId('cmd-save').click()]);
  expect(d1.suggestedFilename()).toMatch(/\.linewright\.json$/);
  const text1 = readFileSync((await d1.path())!, 'utf8');
  const inApp = await page.evaluate(() => window.__linewright!.doc());
  expect(JSON.parse(text1)).toEqual(inApp);

  await page.getByTestId('cmd-new').click();
  await expect(page.locator('.react-flow__node')).toHaveCount(0);
  await page.getByTestId('open-file-input').setInputFiles({ name: d1.suggestedFilename(), mimeType: 'application/json', buffer: Buffer.from(text1) });
  await expect(page.getByTestId('notice').filter({ hasText: 'Opened' })).toBeVisible();
  await expect(page.locator('.react-flow__node')).toHaveCount(demo.nodes.length);
  const [d2] = await Promise.all([page.waitForEvent('download'), page.getByTestId('cmd-save').click()]);
  expect(readFileSync((await d2.path())!, 'utf8')).toBe(text1);
});

test('export the permit-set PDF', async ({ page }, info) => {
  await openApp(page);
  await checked(page);
  const [dl] = await Promise.all([page.waitForEvent('download'), page.getByTestId('cmd-pdf').click()]);
  expect(dl.suggestedFilename()).toMatch(/\.pdf$/);
  const pdfPath = info.outputPath('permit-set.pdf');
  await dl.saveAs(pdfPath);
  expect(readFileSync(pdfPath).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  const pngBase = info.outputPath('permit-set-page1');
  execFileSync('pdftoppm', ['-png', '-singlefile', '-r', '60', '-f', '1', '-l', '1', pdfPath, pngBase]);
  const png = readFileSync(`${pngBase}.png`);
  expect(png.subarray(1, 4).toString('latin1')).toBe('PNG');
  await info.attach('permit-set page 1', { path: `${pngBase}.png`, contentType: 'image/png' });
});

test('labels are text, never markup', async ({ page }, info) => {
  let dialogs = 0;
  page.on('dialog', (d) => {
    dialogs++;
    void d.dismiss();
  });
  await openApp(page);
  const id = await page.evaluate(() => window.__linewright!.doc().nodes[0]!.id);
  await clickNode(page, id);
  const evil = '<img src=x onerror=alert(1)>';
  await setField(page, 'label', evil);
  await expect(page.getByTestId(`node-${id}`)).toContainText(evil);
  await expect(page.locator('.react-flow img')).toHaveCount(0);
  await page.waitForTimeout(200);
  expect(dialogs).toBe(0);
  await shot(page, info, 'label-as-text');
});

test('move, copy, paste and delete are each one undo step', async ({ page }) => {
  await openApp(page);
  await checked(page);
  const id = await page.evaluate(() => window.__linewright!.doc().nodes.find((n) => n.kind === 'load')!.id);
  const node = page.getByTestId(`node-${id}`);
  const start = await page.evaluate((i) => window.__linewright!.doc().nodes.find((n) => n.id === i)!.position, id);
  const versionBefore = await page.evaluate(() => window.__linewright!.docVersion());
  const box = (await node.boundingBox())!;
  const gx = box.x + box.width * 0.6;
  const gy = box.y + box.height * 0.3;
  await page.mouse.move(gx, gy);
  await page.mouse.down();
  for (let i = 1; i <= 10; i++) await page.mouse.move(gx + i * 8, gy + i * 4);
  await page.mouse.up();
  // A drag of ten pointer moves commits once.
  expect(await page.evaluate(() => window.__linewright!.docVersion())).toBe(versionBefore + 1);
  await expect(page.getByTestId('history-hint')).toContainText('Move');
  await page.keyboard.press('Control+z');
  expect(await page.evaluate((i) => window.__linewright!.doc().nodes.find((n) => n.id === i)!.position, id)).toEqual(start);

  const count = demo.nodes.length;
  await clickNode(page, id);
  await page.keyboard.press('Control+c');
  await page.keyboard.press('Control+v');
  await expect(page.locator('.react-flow__node')).toHaveCount(count + 1);
  await page.keyboard.press('Delete');
  await expect(page.locator('.react-flow__node')).toHaveCount(count);
  await page.keyboard.press('Control+z');
  await expect(page.locator('.react-flow__node')).toHaveCount(count + 1);
  await page.keyboard.press('Control+z');
  await expect(page.locator('.react-flow__node')).toHaveCount(count);
});

test('multi-select, arrange top to bottom and drop a file onto the window', async ({ page }, info) => {
  await openApp(page);
  await checked(page);
  const [a, b] = await page.evaluate(() => window.__linewright!.doc().nodes.filter((n) => n.kind === 'load').slice(0, 2).map((n) => n.id));
  await clickNode(page, a!);
  await clickNode(page, b!, ['Control']);
  await expect(page.getByTestId('details')).toContainText('2 elements selected');
  await expect(page.locator('.react-flow__node.selected')).toHaveCount(2);

  const before = await page.evaluate(() => window.__linewright!.doc().nodes.map((n) => n.position));
  await page.getByTestId('cmd-arrange').click();
  await expect(page.getByTestId('history-hint')).toContainText('Arrange top to bottom');
  const after = await page.evaluate(() => window.__linewright!.doc().nodes);
  expect(after.map((n) => n.position)).not.toEqual(before);
  // Top to bottom: every conductor and bus link runs downward (supply above load).
  const y = new Map(after.map((n) => [n.id, n.position!.y]));
  const links = await page.evaluate(() => [...window.__linewright!.doc().conductors, ...window.__linewright!.doc().busLinks].map((c) => [c.from, c.to]));
  for (const [from, to] of links) expect(y.get(to!)!).toBeGreaterThan(y.get(from!)!);
  await page.waitForTimeout(200);
  await shot(page, info, 'arranged');
  await page.keyboard.press('Control+z');
  expect(await page.evaluate(() => window.__linewright!.doc().nodes.map((n) => n.position))).toEqual(before);

  // Drag and drop of a project file: the same open path as the picker.
  const text = JSON.stringify({ ...demo, project: { ...(demo as unknown as { project: object }).project, name: 'Dropped copy' } });
  await page.evaluate((t) => {
    const dt = new DataTransfer();
    dt.items.add(new File([t], 'dropped.json', { type: 'application/json' }));
    window.dispatchEvent(new DragEvent('dragover', { dataTransfer: dt, bubbles: true, cancelable: true }));
    window.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
  }, text);
  await expect(page.getByTestId('project-name')).toHaveText('Dropped copy');
});

test('Escape during a drag puts the equipment back; two selected pieces connect from the panel', async ({ page }) => {
  await openApp(page);
  await page.getByTestId('cmd-new').click();
  for (const kind of ['breaker', 'load']) await page.getByTestId(`palette-${kind}`).click();
  const [b, l] = await page.evaluate(() => window.__linewright!.doc().nodes.map((n) => n.id));
  const start = await page.evaluate(() => window.__linewright!.doc().nodes.map((n) => n.position));
  const version = await page.evaluate(() => window.__linewright!.docVersion());
  const box = (await page.getByTestId(`node-${l}`).boundingBox())!;
  await page.mouse.move(box.x + box.width * 0.6, box.y + box.height * 0.3);
  await page.mouse.down();
  for (let i = 1; i <= 8; i++) await page.mouse.move(box.x + box.width * 0.6 + i * 10, box.y + box.height * 0.3 + 120 + i * 5);
  await page.keyboard.press('Escape');
  await page.mouse.up();
  expect(await page.evaluate(() => window.__linewright!.docVersion())).toBe(version);
  expect(await page.evaluate(() => window.__linewright!.doc().nodes.map((n) => n.position))).toEqual(start);

  // The load was placed below-right of the breaker, so the breaker is the supply side.
  await clickNode(page, b!);
  await clickNode(page, l!, ['Control']);
  await page.getByTestId('connect-pair-conductor').click();
  const c = await page.evaluate(() => window.__linewright!.doc().conductors[0]);
  expect(c).toMatchObject({ from: b, to: l });
  await expect(page.getByTestId('working-verdict')).toBeVisible();
});
