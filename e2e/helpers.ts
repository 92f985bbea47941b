import { expect, type Page, type TestInfo } from '@playwright/test';

/** Opens the app on a fresh profile and acknowledges the first-start caution. */
export async function openApp(page: Page): Promise<void> {
  await page.goto('/');
  const caution = page.getByTestId('caution-dialog');
  await expect(caution).toBeVisible();
  await expect(caution).toContainText('authority having jurisdiction');
  await page.getByTestId('caution-ok').click();
  await expect(caution).toBeHidden();
}

/** Saves a screenshot of the step as a test artifact. */
export async function shot(page: Page, info: TestInfo, name: string): Promise<void> {
  const path = info.outputPath(`${String(++counter.n).padStart(2, '0')}-${name}.png`);
  await page.screenshot({ path });
  await info.attach(name, { path, contentType: 'image/png' });
}
const counter = { n: 0 };

/** Waits until the check has caught up with the last edit. */
export async function checked(page: Page): Promise<void> {
  await page.waitForFunction(() => {
    const h = window.__linewright;
    return !!h && h.reportVersion() === h.docVersion();
  });
}

export async function nodeIdsOfKind(page: Page, kind: string): Promise<string[]> {
  return page.evaluate((k) => window.__linewright!.doc().nodes.filter((n) => n.kind === k).map((n) => n.id), kind);
}

/** Drags from one port to another with the mouse, as a user draws a connection. */
export async function dragPort(page: Page, fromTestId: string, toTestId: string): Promise<void> {
  const a = await page.getByTestId(fromTestId).boundingBox();
  const b = await page.getByTestId(toTestId).boundingBox();
  if (!a || !b) throw new Error(`port not on screen: ${fromTestId} or ${toTestId}`);
  await page.mouse.move(a.x + a.width / 2, a.y + a.height / 2);
  await page.mouse.down();
  await page.mouse.move((a.x + b.x) / 2 + 20, (a.y + b.y) / 2, { steps: 6 });
  await page.mouse.move(b.x + b.width / 2, b.y + b.height / 2, { steps: 6 });
  await page.mouse.up();
}

/** Types a value into a details field and commits it with Enter. */
export async function setField(page: Page, key: string, value: string): Promise<void> {
  const f = page.getByTestId(`field-${key}`);
  await f.fill(value);
  await f.press('Enter');
}

/** The verdict shown on the drawing for a conductor. */
export function verdictOf(page: Page, conductorId: string) {
  return page.getByTestId(`conductor-label-${conductorId}`);
}

/** Clicks a node on its name, right of the symbol, whatever the zoom. */
export async function clickNode(page: Page, id: string, modifiers?: ('Control' | 'Shift')[]): Promise<void> {
  const n = page.getByTestId(`node-${id}`);
  const box = await n.boundingBox();
  if (!box) throw new Error(`node ${id} not on screen`);
  await n.click({ position: { x: box.width * 0.6, y: box.height * 0.3 }, modifiers });
}
