import type { Citation } from '@linewright/core';

export function citeText(c: Citation): string {
  return `NEC ${c.edition} ${c.section}`;
}
