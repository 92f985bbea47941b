import { expect, test } from '@playwright/test';
import { openApp } from './helpers';

// The editor tells React Flow where each kind's ports are before it draws a node (web/src/canvas/ports.ts), so a
// node out of view is never mounted only to be measured. Those places must be the ones React Flow measures on the
// drawn node, or a wire dragged to a port would snap beside it.
test('the ports given for every kind of equipment are where the drawn node has them', async ({ page }) => {
  await openApp(page);
  await page.getByTestId('cmd-new').click();
  await expect(page.locator('.react-flow__node')).toHaveCount(0);
  const kinds = page.locator('.lw-palette-item');
  const count = await kinds.count();
  expect(count).toBeGreaterThanOrEqual(9);
  for (let i = 0; i < count; i++) await kinds.nth(i).click();
  await expect(page.locator('.react-flow__node')).toHaveCount(count);
  const geo = await page.evaluate(() => window.__linewright!.geometry());
  expect(new Set(geo.nodes.map((n) => n.id)).size).toBe(count);
  for (const n of geo.nodes) {
    const node = page.locator(`.react-flow__node[data-id="${n.id}"]`);
    await expect(node).toBeVisible();
    // React Flow's own measure (getHandleBounds in @xyflow/system): each port's box from the node's, in flow units.
    const measured = await node.evaluate((el) => {
      const zoom = new DOMMatrix(getComputedStyle(el.closest('.react-flow__viewport')!).transform).a;
      const nb = el.getBoundingClientRect();
      return Array.from(el.querySelectorAll<HTMLElement>('.react-flow__handle')).map((h) => {
        const hb = h.getBoundingClientRect();
        return { id: h.dataset.handleid ?? null, x: (hb.left - nb.left) / zoom, y: (hb.top - nb.top) / zoom, width: h.offsetWidth, height: h.offsetHeight };
      });
    });
    expect(measured.map((m) => m.id), n.id).toEqual(n.ports.map((p) => p.id));
    expect(measured.length, n.id).toBeGreaterThan(0);
    for (const [i, p] of n.ports.entries()) {
      const m = measured[i]!;
      expect(Math.abs(m.x - p.x), `${n.id} ${p.id} x`).toBeLessThan(0.5);
      expect(Math.abs(m.y - p.y), `${n.id} ${p.id} y`).toBeLessThan(0.5);
      expect([m.width, m.height], `${n.id} ${p.id} size`).toEqual([p.width, p.height]);
    }
  }
});
