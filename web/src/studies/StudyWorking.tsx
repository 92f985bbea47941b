import { faultText, faultWorking, pctText } from '@linewright/core';
import { useEditorState } from '../editor/useEditor';

const ohms = (x: number) => (Math.abs(x) < 1e-4 ? x.toExponential(2) : x.toFixed(5));

/** Short-circuit working at a node: each element's R + jX with its source, the sum, the result. */
export function FaultWorkingPanel({ nodeId }: { nodeId: string }) {
  const report = useEditorState((s) => s.report);
  const w = report ? faultWorking(report, nodeId) : null;
  if (!w) return null;
  const f = w.fault;
  return (
    <section className="lw-study-working" data-testid="fault-working">
      <h4>Available fault current</h4>
      <p>
        <strong>{faultText(f.kA, f.upperBound)}</strong>
        {f.xOverR !== null && Number.isFinite(f.xOverR) ? `, X/R ${f.xOverR.toFixed(1)}` : ''}
        {f.lineToGroundKA !== null ? `; line to ground ${faultText(f.lineToGroundKA, false)}` : ''}
        {f.motorKA > 0 ? `; includes ${f.motorKA.toFixed(2)} kA from motors` : ''}
        {f.unknownWhy ? ` (${f.unknownWhy})` : ''}
      </p>
      <ol className="lw-steps">
        {w.steps.map((s) => (
          <li key={s.nodeId}>
            {s.nodeId}: R {ohms(s.rOhm)} + jX {ohms(s.xOhm)} Ω{s.voltsLL ? ` at ${s.voltsLL} V` : ''} — {s.source}
          </li>
        ))}
      </ol>
      {f.rOhm !== null && f.xOhm !== null && f.voltsLL !== null && (
        <p className="lw-muted">
          Sum at {f.nodeId}: {ohms(f.rOhm)} + j{ohms(f.xOhm)} Ω, |Z| = {ohms(Math.hypot(f.rOhm, f.xOhm))} Ω; I = {f.voltsLL} V / ({f.kind === 'load' ? '' : '√3 × '}|Z|){f.motorKA > 0 ? ' + motors' : ''} = {faultText(f.kA, f.upperBound)}. Ohmic method, IEEE Std 141; conductors from NFPA 70 Chapter 9 Table 9.
        </p>
      )}
    </section>
  );
}

/** Voltage drop of one conductor: its own, its circuit's and the total at its load end. */
export function DropWorkingPanel({ conductorId }: { conductorId: string }) {
  const report = useEditorState((s) => s.report);
  const i = report ? report.conductors.findIndex((c) => c.id === conductorId) : -1;
  const d = i >= 0 ? report?.studies?.voltageDrop.conductors[i] : undefined;
  if (!report?.studies || !d) return null;
  const v = report.studies.voltageDrop;
  return (
    <section className="lw-study-working" data-testid="drop-working">
      <h4>Voltage drop</h4>
      <p>
        This conductor {pctText(d.pct)}; circuit {pctText(d.circuitPct)} (limit {v.circuitLimitPct} %); total {pctText(d.totalPct)} (limit {v.totalLimitPct} %).
        {d.currentA !== null ? ` ${d.currentA.toFixed(1)} A at PF ${d.powerFactor?.toFixed(2) ?? '?'}.` : ''}
      </p>
      <p className="lw-muted">Chapter 9 Table 9 effective impedance R·cos θ + X·sin θ; three-phase √3·I·Z·L, single-phase 2·I·Z·L, over the circuit voltage.</p>
    </section>
  );
}
