import { FAMILY_LOOK, type VerdictFamily } from '../analysis/verdicts';

/** The badge shape of a verdict family, centred on (x, y). Used on the drawing and in the panels. */
export function VerdictBadge({ family, x, y, size }: { family: VerdictFamily; x: number; y: number; size: number }) {
  const look = FAMILY_LOOK[family];
  const r = size / 2;
  const common = { fill: look.colour, stroke: '#000', strokeWidth: 0.6 };
  switch (look.badge) {
    case 'circle':
      return <circle cx={x} cy={y} r={r} {...common} />;
    case 'diamond':
      return <path d={`M ${x} ${y - r - 1} L ${x + r + 1} ${y} L ${x} ${y + r + 1} L ${x - r - 1} ${y} Z`} {...common} />;
    case 'triangle':
      return <path d={`M ${x} ${y - r - 1} L ${x + r + 1} ${y + r} L ${x - r - 1} ${y + r} Z`} {...common} />;
    case 'square':
      return <rect x={x - r} y={y - r} width={size} height={size} {...common} />;
    case 'none':
      return <circle cx={x} cy={y} r={r} fill="none" stroke={look.colour} strokeWidth={1.2} />;
  }
}

/** A badge as a tiny inline SVG for HTML text. */
export function InlineBadge({ family }: { family: VerdictFamily }) {
  return (
    <svg className="lw-inline-badge" width={14} height={14} viewBox="0 0 14 14" aria-hidden="true">
      <VerdictBadge family={family} x={7} y={7} size={10} />
    </svg>
  );
}
