import type { CodeEdition, NodeId } from '../model/schema';
import { atLeast, defineRule, when, type Check } from './define';
import type { TransformerFacts } from './facts';

/** What 408.36 reads about one panelboard. */
export interface PanelboardFacts {
  edition: CodeEdition;
  id: NodeId;
  label: string;
  /** Panelboard (bus) rating; null when not given. */
  ratingA: number | null;
  /**
   * The OCPD that protects it: a main in it (a breaker or fuses bus-linked to
   * its bus) or the first one on its supply side; null when the walk up
   * reaches a source, or a transformer, without meeting one.
   */
  device: { id: NodeId; label: string; ratingA: number | null; where: 'main' | 'supply-side' } | null;
  /** Supplied through this transformer with no OCPD between its secondary and the panelboard (408.36(B)). */
  transformer: TransformerFacts | null;
}

/** 240.21(C)(1) secondaries, the only ones 408.36(B)'s exception lets the primary device protect. */
const PRIMARY_PROTECTED_CONNECTIONS: ReadonlySet<string> = new Set(['single-phase-2w', 'delta-delta-3w']);

/**
 * 408.36: a panelboard is protected by an OCPD rated not above the
 * panelboard, in it or on its supply side. 408.36(B): through a transformer
 * that OCPD is on the secondary side, except where the primary device
 * protects the secondary under 240.21(C)(1) (2-wire single-phase or 3-wire
 * delta-delta): then primary rating × Vp / Vs must not exceed the
 * panelboard rating. An equipment rule: it adds a finding on the panelboard.
 */
export const panelboardProtection = defineRule({
  id: 'panelboard-protection',
  verdict: null,
  family: 'equipment',
  section: '408.36',
  title: 'Panelboard overcurrent protection',
  messages: {
    device: '{{panel}} must be protected by an OCPD in it or on its supply side{{transformerNote}} (found: {{found}}).',
    rating: 'The protecting device ({{device}}, {{deviceA}}) must not exceed the panelboard rating ({{panelA}}).',
  },
  check(f: PanelboardFacts) {
    const t = f.transformer;
    const viaPrimary = t !== null && f.device !== null && PRIMARY_PROTECTED_CONNECTIONS.has(t.connection);
    const hasDevice = f.device !== null && (t === null || viaPrimary);
    const found = f.device === null ? 'none' : t !== null && !viaPrimary ? `only ${f.device.label} on the primary of ${t.label}` : f.device.label;
    const transformerNote = t === null ? '' : `, on the secondary side of ${t.label} unless 240.21(C)(1) applies (408.36(B))`;
    const out: Check<'device' | 'rating'>[] = [when('device', hasDevice, { panel: f.label, transformerNote, found })];
    if (!hasDevice || f.device === null) return out;
    // Through a 240.21(C)(1) transformer the primary device counts at primary rating × Vp / Vs (408.36(B) Exception).
    const deviceA = f.device.ratingA === null ? null : viaPrimary ? (f.device.ratingA * t.primaryVoltsLL) / t.secondaryVoltsLL : f.device.ratingA;
    const deviceText =
      deviceA === null ? 'rating not given' : viaPrimary ? `${f.device.ratingA} A × ${t.primaryVoltsLL} V / ${t.secondaryVoltsLL} V = ${Math.round(deviceA * 100) / 100} A` : `${deviceA} A`;
    out.push(
      when('rating', atLeast(f.ratingA, deviceA), {
        device: `${f.device.label}, ${f.device.where === 'main' ? 'its main' : 'on its supply side'}`,
        deviceA: deviceText,
        panelA: f.ratingA === null ? 'not given' : `${f.ratingA} A`,
      }),
    );
    return out;
  },
});
