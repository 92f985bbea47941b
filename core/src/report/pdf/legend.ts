import type { EquipmentNode } from '../../model/schema';
import { VERDICT_WORDS, type VerdictClass } from '../format';
import { STYLE, type Sheet } from './sheet';
import { callout, drawSymbol } from './symbols';

export function drawLegend(sh: Sheet, x: number, y: number, w: number): number {
  const d = sh.doc;
  sh.font(11, 'bold');
  sh.text('Legend', x, y + 11);
  y += 20;
  sh.font(7.5, 'bold');
  sh.text('Conductor marks (line style and words; colour only repeats them)', x, y);
  y += 10;
  for (const cls of ['protected', 'tap-rule', 'failing', 'incomplete'] as VerdictClass[]) {
    const st = STYLE[cls];
    sh.stroke(st.color, st.width, st.dash);
    d.line(x, y - 2.5, x + 34, y - 2.5);
    sh.font(7, 'normal');
    const lines = sh.split(st.legend, w - 42);
    sh.text(lines, x + 40, y);
    y += 9 * lines.length + 3;
  }
  callout(sh, 'violation', 1, x + 17, y, 5);
  sh.font(7, 'normal');
  sh.text('numbered circle: violation, see Findings', x + 40, y + 2.5);
  y += 14;
  callout(sh, 'needs-ahj', 2, x + 17, y, 5);
  sh.font(7, 'normal');
  sh.text('numbered triangle: needs AHJ review', x + 40, y + 2.5);
  y += 14;
  sh.font(7, 'normal');
  const words = sh.split(`Verdict words under each conductor: ${Object.values(VERDICT_WORDS).join(' / ')}; the section in brackets is the rule relied on.`, w);
  sh.text(words, x, y);
  y += 8.5 * words.length + 6;

  sh.font(7.5, 'bold');
  sh.text('Symbols (IEEE Std 315 style)', x, y);
  y += 6;
  const kinds: [EquipmentNode, string][] = [
    [{ kind: 'utility', id: 'u', voltsLL: 480, phases: 3 } as EquipmentNode, 'utility source'],
    [{ kind: 'generator', id: 'g', voltsLL: 480, phases: 3, kva: 1, overloadPreventedByDesign: false } as EquipmentNode, 'generator'],
    [{ kind: 'breaker', id: 'b', arrangement: 'single', atDisconnectingMeans: false } as EquipmentNode, 'circuit breaker'],
    [{ kind: 'fuse', id: 'f', arrangement: 'single', atDisconnectingMeans: false, currentLimiting: false } as EquipmentNode, 'fuse'],
    [{ kind: 'disconnect', id: 'd' } as EquipmentNode, 'unfused disconnect'],
    [{ kind: 'transformer', id: 't', kva: 1, primaryVoltsLL: 480, secondaryVoltsLL: 208, phases: 3, connection: 'delta-wye' } as EquipmentNode, 'transformer'],
    [{ kind: 'bus', id: 'bb', busType: 'panelboard' } as EquipmentNode, 'bus bar'],
    [{ kind: 'splice', id: 's' } as EquipmentNode, 'splice or tap point'],
    [{ kind: 'load', id: 'l', powerFactor: 0.9, continuous: false } as EquipmentNode, 'load'],
  ];
  const colW = w / 2;
  kinds.forEach(([n, label], i) => {
    const cx = x + (i % 2) * colW + 10;
    const cy = y + 14 + Math.floor(i / 2) * 24;
    drawSymbol(sh, n, cx, cy, 8, 12);
    sh.font(7, 'normal');
    sh.text(label, cx + 16, cy + 2.5);
  });
  return y + 14 + Math.ceil(kinds.length / 2) * 24;
}
