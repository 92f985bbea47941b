import { useState } from 'react';
import type { Conductor } from '@linewright/core';
import { INSERTABLE_KINDS, convertConnection, insertIntoConductor, insertProblem } from '../editor/commands';
import { formatNum, kindSpec } from '../editor/equipment';
import { useCommandContext } from '../editor/useEditor';

/**
 * Under a selected conductor: insert a device or splice into it (the length split where the user
 * says), or make it a bus link. The digit keys insert at half the length.
 */
export function ConductorTools({ c }: { c: Conductor }) {
  const ctx = useCommandContext();
  const half = c.lengthFt === undefined ? '' : formatNum(c.lengthFt / 2);
  const [at, setAt] = useState(half);
  const supplySideFt = at.trim() === '' ? undefined : Number(at);
  const problem = insertProblem(ctx.store.getState().doc, { conductorId: c.id, kind: 'breaker', ...(supplySideFt === undefined ? {} : { supplySideFt }) });
  return (
    <fieldset className="lw-group lw-insert" data-testid="insert-tools">
      <legend>Insert into this conductor</legend>
      <label className="lw-field">
        <span>Length from the supply end (ft){c.lengthFt === undefined ? '' : `, of ${formatNum(c.lengthFt)} ft`}</span>
        <input value={at} inputMode="decimal" onChange={(e) => setAt(e.target.value)} data-testid="insert-at" aria-invalid={problem !== null} />
      </label>
      {problem && <span className="lw-field-error" role="alert">{problem}</span>}
      <div className="lw-fixes">
        {INSERTABLE_KINDS.map((k) => (
          <button
            key={k}
            type="button"
            disabled={problem !== null}
            data-testid={`insert-${k}`}
            onClick={() => insertIntoConductor.run(ctx, { conductorId: c.id, kind: k, ...(supplySideFt === undefined ? {} : { supplySideFt }) })}
            title={`Split ${c.id}: the supply-side part keeps its facts and id; the load-side part is a copy with the rest of the length.`}
          >
            {kindSpec(k).short}
          </button>
        ))}
      </div>
      <p className="lw-field-help">
        Not a conductor but a bus link inside equipment?{' '}
        <button type="button" className="lw-link" data-testid="make-buslink" onClick={() => convertConnection.run(ctx, { kind: 'conductor', id: c.id })}>
          Make it a bus link
        </button>
      </p>
    </fieldset>
  );
}

export function BusLinkTools({ id }: { id: string }) {
  const ctx = useCommandContext();
  return (
    <p className="lw-field-help">
      Runs outside the equipment?{' '}
      <button type="button" className="lw-link" data-testid="make-conductor" onClick={() => convertConnection.run(ctx, { kind: 'busLink', id })}>
        Make it a conductor
      </button>
    </p>
  );
}
