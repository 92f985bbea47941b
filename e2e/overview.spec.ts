import { expect, test, type Page } from '@playwright/test';
import { generateProject } from '../core/bench/generateProject';
import { segmentDistance } from '../web/src/canvas/pointDistance';
import { checked, openApp, shot } from './helpers';

// A generated drawing of 1 000 conductors (about 4 000 elements): framed whole it sits below zoom 0.1,
// where the canvas draws it as one bitmap with every element hidden from React Flow (canvas/Overview.tsx).
const drawing = generateProject({ conductors: 1000, seed: 11 });

/** React Flow's transform, and the drawing's box on the page. */
async function view(page: Page) {
  const m = await page.locator('.react-flow__viewport').evaluate((el) => {
    const t = new DOMMatrix(getComputedStyle(el).transform);
    return { e: t.e, f: t.f, a: t.a };
  });
  const box = (await page.locator('.react-flow').boundingBox())!;
  return { x: m.e, y: m.f, zoom: m.a, left: box.x, top: box.y, width: box.width, height: box.height };
}

/** The app with the campus opened and checked. */
async function openCampus(page: Page) {
  await openApp(page);
  await checked(page);
  await page.evaluate((text) => window.__linewright!.open(text, 'campus.json'), JSON.stringify(drawing));
  await checked(page);
}

test('far out, a click picks a piece or a conductor and a Shift-drag box selects what it covers', async ({ page }, info) => {
  await openCampus(page);
  const overview = page.getByTestId('overview');
  await expect(overview).toBeVisible();
  await expect(page.locator('.react-flow__node')).toHaveCount(0);
  // Framed whole, the campus is a thin strip at the least zoom; six steps in (1.2 each) it is still far out, and roomier.
  const zoomIn = page.locator('.react-flow__controls-zoomin');
  for (let i = 0; i < 6; i++) {
    const before = (await view(page)).zoom;
    await zoomIn.click();
    await expect.poll(async () => (await view(page)).zoom).toBeCloseTo(before * 1.2, 4);
  }
  const v = await view(page);
  expect(v.zoom).toBeLessThan(0.1);
  await expect(overview).toBeVisible();
  const doc = await page.evaluate(() => window.__linewright!.doc());
  const geo = await page.evaluate(() => window.__linewright!.geometry());
  const boxes = geo.nodes;
  const boxOf = new Map(boxes.map((b) => [b.id, b]));
  const toScreen = (x: number, y: number) => ({ x: v.left + v.x + x * v.zoom, y: v.top + v.y + y * v.zoom });
  // The campus is wider than the view at the least zoom: only what is on screen (away from the edges' panels) is clicked.
  const onScreen = (x: number, y: number) => {
    const p = toScreen(x, y);
    return p.x > v.left + 80 && p.x < v.left + v.width - 80 && p.y > v.top + 80 && p.y < v.top + v.height - 80;
  };

  // A click on the middle of a panelboard's box picks it, and the details panel shows it.
  const panel = doc.nodes.find((n) => n.kind === 'bus' && n.busType === 'panelboard' && onScreen(boxOf.get(n.id)!.x, boxOf.get(n.id)!.y))!;
  const pb = boxOf.get(panel.id)!;
  const at = toScreen(pb.x + pb.w / 2, pb.y + pb.h / 2);
  await page.mouse.click(at.x, at.y);
  await expect.poll(() => page.evaluate(() => window.__linewright!.selection())).toEqual({ nodes: [panel.id], conductors: [], busLinks: [] });
  await expect(page.getByTestId('details')).toContainText(panel.label ?? panel.id);
  await shot(page, info, 'overview-picked');

  // A click on a conductor's wire picks the conductor: the middle of the longest leg of a run with clear
  // paper around it (2 px on screen), where no other wire or piece is as near.
  const wires = geo.conductors;
  const midOfLongest = (pts: { x: number; y: number }[]) => {
    let best = { x: pts[0]!.x, y: pts[0]!.y, len: -1 };
    for (let i = 1; i < pts.length; i++) {
      const len = Math.hypot(pts[i]!.x - pts[i - 1]!.x, pts[i]!.y - pts[i - 1]!.y);
      if (len > best.len) best = { x: (pts[i]!.x + pts[i - 1]!.x) / 2, y: (pts[i]!.y + pts[i - 1]!.y) / 2, len };
    }
    return best;
  };
  const clear = 2 / v.zoom;
  const target = wires.map((w) => ({ id: w.id, at: midOfLongest(w.points) })).find(({ id, at: p }) =>
    onScreen(p.x, p.y) &&
    boxes.every((b) => p.x < b.x - clear || p.x > b.x + b.w + clear || p.y < b.y - clear || p.y > b.y + b.h + clear) &&
    wires.every((w) => w.id === id || w.points.every((q, i) => i === 0 || segmentDistance(p, w.points[i - 1]!, q) > clear)),
  )!;
  expect(target).toBeTruthy();
  const onWire = toScreen(target.at.x, target.at.y);
  await page.mouse.click(onWire.x, onWire.y);
  await expect.poll(() => page.evaluate(() => window.__linewright!.selection())).toEqual({ nodes: [], conductors: [target.id], busLinks: [] });
  // Above the drawing's top row there is only paper.
  const top = Math.min(...boxes.map((b) => b.y));
  const empty = toScreen(target.at.x, top - 40 / v.zoom);
  await page.mouse.click(empty.x, Math.max(empty.y, v.top + 60));
  await expect.poll(() => page.evaluate(() => window.__linewright!.selection().conductors.length)).toBe(0);

  // Shift and drag a box over part of the view: the pieces wholly inside it, with their conductors and
  // bus links, as a box does up close.
  const fromScreen = (x: number, y: number) => ({ x: (x - v.left - v.x) / v.zoom, y: (y - v.top - v.y) / v.zoom });
  const a = { x: v.left + v.width * 0.3, y: v.top + 60 };
  const b = { x: v.left + v.width * 0.6, y: v.top + v.height * 0.5 };
  const { x: x0, y: y0 } = fromScreen(a.x, a.y);
  const { x: x1, y: y1 } = fromScreen(b.x, b.y);
  await page.keyboard.down('Shift');
  await page.mouse.move(a.x, a.y);
  await page.mouse.down();
  await page.mouse.move((a.x + b.x) / 2, (a.y + b.y) / 2, { steps: 4 });
  await page.mouse.move(b.x, b.y, { steps: 4 });
  await shot(page, info, 'overview-box');
  await page.mouse.up();
  await page.keyboard.up('Shift');
  const inside = boxes.filter((n) => n.x >= x0 && n.y >= y0 && n.x + n.w <= x1 && n.y + n.h <= y1);
  expect(inside.length).toBeGreaterThan(10);
  await expect.poll(() => page.evaluate(() => window.__linewright!.selection().nodes.length)).toBeGreaterThan(0);
  const sel = await page.evaluate(() => window.__linewright!.selection());
  // The box's corners are whole screen pixels: a piece at its very edge may fall either side of it.
  const picked = new Set(sel.nodes);
  expect(inside.filter((n) => !picked.has(n.id)).length).toBeLessThanOrEqual(Math.ceil(inside.length * 0.05));
  expect(sel.nodes.length).toBeLessThanOrEqual(inside.length * 1.05 + 2);
  const linked = doc.conductors.filter((x) => picked.has(x.from) || picked.has(x.to)).map((x) => x.id).sort();
  expect([...sel.conductors].sort()).toEqual(linked);
  await expect(page.getByTestId('details')).toContainText('elements selected');
  await shot(page, info, 'overview-boxed');
});

test('a big drawing restored by a reload is framed whole before any of its elements is mounted', async ({ page }, info) => {
  await openCampus(page);
  await expect(page.getByTestId('overview')).toBeVisible();
  // Saved in this browser (IndexedDB) before the reload.
  await page.waitForFunction(() => {
    const s = window.__linewright!.stats();
    return s.saves > 0 && s.saveIdle;
  });
  // Count every equipment element React Flow mounts from the first moment of the next load.
  await page.addInitScript(() => {
    const w = window as unknown as { __mounted: number };
    w.__mounted = 0;
    new MutationObserver((records) => {
      for (const r of records) for (const n of r.addedNodes) if (n instanceof Element && (n.matches('.react-flow__node') || n.querySelector('.react-flow__node'))) w.__mounted++;
    }).observe(document, { childList: true, subtree: true });
  });
  await page.reload();
  await expect(page.getByTestId('overview')).toBeVisible();
  await checked(page);
  expect(await page.evaluate(() => window.__linewright!.doc().conductors.length)).toBe(drawing.conductors.length);
  await expect(page.getByText('Restored your drawing from this browser')).toBeVisible();
  expect(await page.evaluate(() => (window as unknown as { __mounted: number }).__mounted)).toBe(0);
  await shot(page, info, 'overview-restored');
});

test('up close on a big drawing, a finding far off is framed and drawn', async ({ page }, info) => {
  await openCampus(page);
  await expect(page.getByTestId('overview')).toBeVisible();
  const violations = page.locator('[data-testid="finding"][data-severity="violation"]');
  expect(await violations.count()).toBeGreaterThan(1);
  /** The element a pick selected, as React Flow draws it up close. */
  const drawnSelection = async () => {
    const sel = await page.evaluate(() => window.__linewright!.selection());
    const id = sel.conductors[0] ?? sel.nodes[0] ?? sel.busLinks[0];
    expect(id).toBeDefined();
    return page.locator(sel.nodes[0] === id ? `.react-flow__node[data-id="${id}"]` : `[data-testid="conductor-label-${id}"], [data-testid="buslink-${id}"]`);
  };
  // The first violation: framed up close, past the overview, and drawn.
  await violations.first().click();
  await expect.poll(async () => (await view(page)).zoom).toBeGreaterThan(0.5);
  await expect(page.getByTestId('overview')).toHaveCount(0);
  const first = await drawnSelection();
  await expect(first).toBeVisible();
  // The last one sits elsewhere on the campus: framed from up close, it is drawn there too, and the first is let go.
  await violations.last().click();
  const last = await drawnSelection();
  await expect(last).toBeVisible();
  await expect(first).toHaveCount(0);
  await shot(page, info, 'overview-far-finding');
});
