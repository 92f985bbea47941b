import { EQUIPMENT_KINDS, type EquipmentKind } from '@linewright/core';
import type { ComponentType } from 'react';
import { FAMILY_LOOK, type VerdictFamily } from '../analysis/verdicts';
import { addEquipment } from '../editor/commands';
import { KIND_SPECS } from '../editor/equipment';
import { useCommandContext } from '../editor/useEditor';
import { InlineBadge } from '../edges/VerdictBadge';
import { Collapsible } from './Collapsible';
import {
  BreakerSymbol, BusSymbol, DisconnectSymbol, FuseSymbol, GeneratorSymbol, LoadSymbol, SpliceSymbol, TransformerSymbol, UtilitySymbol,
} from '../nodes';

export const KIND_DRAG_TYPE = 'application/x-linewright-kind';

const SYMBOLS = {
  utility: UtilitySymbol, generator: GeneratorSymbol, bus: BusSymbol, breaker: BreakerSymbol, fuse: FuseSymbol,
  disconnect: DisconnectSymbol, splice: SpliceSymbol, transformer: TransformerSymbol, load: LoadSymbol,
} satisfies Record<EquipmentKind, ComponentType>;

/** Every equipment kind of the core model: click to place in the middle of the view, or drag onto the drawing. */
export function Palette() {
  const ctx = useCommandContext();
  return (
    <Collapsible id="equipment" title="Equipment" className="lw-palette">
      <div className="lw-palette-grid">
        {EQUIPMENT_KINDS.map((k, i) => {
          const spec = KIND_SPECS[k];
          const Sym = SYMBOLS[k];
          const w = k === 'bus' ? spec.width : 40;
          return (
            <button
              key={k}
              type="button"
              className="lw-palette-item"
              data-testid={`palette-${k}`}
              draggable
              onDragStart={(e) => {
                e.dataTransfer.setData(KIND_DRAG_TYPE, k);
                e.dataTransfer.effectAllowed = 'copy';
              }}
              onClick={() => addEquipment.run(ctx, { kind: k })}
              aria-keyshortcuts={String(i + 1)}
              title={`Add ${spec.title.toLowerCase()} (key ${i + 1}; click, or drag onto the drawing). With one piece selected it goes below it, connected.`}
            >
              <svg width={28} height={34} viewBox={k === 'bus' ? `${spec.wireX - 40} 0 80 ${spec.height}` : `0 0 ${w} ${spec.height}`} className="lw-symbol-mini" aria-hidden="true">
                <Sym />
              </svg>
              <span>{spec.short}</span>
              <kbd className="lw-key" aria-hidden="true">{i + 1}</kbd>
            </button>
          );
        })}
      </div>
    </Collapsible>
  );
}

const FAMILIES: VerdictFamily[] = ['protected', 'tap-rule', 'failing', 'incomplete'];

/** What the line styles and badges on the drawing mean. */
export function Legend() {
  return (
    <Collapsible id="legend" title="Legend" className="lw-legend" testId="legend" defaultOpen={window.innerHeight >= 900}>
      <ul>
        {FAMILIES.map((f) => (
          <li key={f}>
            <svg width={34} height={10} aria-hidden="true">
              <line x1={1} y1={5} x2={33} y2={5} stroke={FAMILY_LOOK[f].colour} strokeWidth={FAMILY_LOOK[f].strokeWidth} strokeDasharray={FAMILY_LOOK[f].dash || undefined} />
            </svg>
            <InlineBadge family={f} />
            <span>{FAMILY_LOOK[f].legend}</span>
          </li>
        ))}
        <li>
          <svg width={34} height={10} aria-hidden="true">
            <line x1={1} y1={5} x2={33} y2={5} className="lw-buslink-outer" />
            <line x1={1} y1={5} x2={33} y2={5} className="lw-buslink-inner" />
          </svg>
          <span>bus link inside equipment (no length)</span>
        </li>
      </ul>
    </Collapsible>
  );
}
