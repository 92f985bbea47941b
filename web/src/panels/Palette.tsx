import { EQUIPMENT_KINDS, type EquipmentKind } from '@linewright/core';
import type { ComponentType } from 'react';
import { FAMILY_LOOK, type VerdictFamily } from '../analysis/verdicts';
import { addEquipment } from '../editor/commands';
import { KIND_SPECS } from '../editor/equipment';
import { useCommandContext } from '../editor/useEditor';
import { InlineBadge } from '../edges/VerdictBadge';
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
    <section className="lw-palette" aria-label="Equipment">
      <h2>Equipment</h2>
      <div className="lw-palette-grid">
        {EQUIPMENT_KINDS.map((k) => {
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
              title={`Add ${spec.title.toLowerCase()} (click, or drag onto the drawing)`}
            >
              <svg width={28} height={34} viewBox={k === 'bus' ? `${spec.wireX - 40} 0 80 ${spec.height}` : `0 0 ${w} ${spec.height}`} className="lw-symbol-mini" aria-hidden="true">
                <Sym />
              </svg>
              <span>{spec.short}</span>
            </button>
          );
        })}
      </div>
    </section>
  );
}

const FAMILIES: VerdictFamily[] = ['protected', 'tap-rule', 'failing', 'incomplete'];

/** What the line styles and badges on the drawing mean. */
export function Legend() {
  return (
    <section className="lw-legend" aria-label="Legend" data-testid="legend">
      <h2>Legend</h2>
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
    </section>
  );
}
