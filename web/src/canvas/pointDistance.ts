/** Plain plane geometry with no imports, so the e2e suite can use it in Node as the canvas does in the page. */

interface P {
  x: number;
  y: number;
}

/** Distance from `p` to the segment from `a` to `b`. */
export function segmentDistance(p: P, a: P, b: P): number {
  const vx = b.x - a.x;
  const vy = b.y - a.y;
  const len2 = vx * vx + vy * vy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * vx + (p.y - a.y) * vy) / len2));
  return Math.hypot(p.x - (a.x + t * vx), p.y - (a.y + t * vy));
}
