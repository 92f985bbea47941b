/** Runs `fn` when the page is idle (requestIdleCallback where there is one), at the latest after `timeoutMs`. */
export function whenIdle(fn: () => void, timeoutMs: number): void {
  if (typeof requestIdleCallback === 'function') requestIdleCallback(fn, { timeout: timeoutMs });
  else setTimeout(fn, 0);
}
