import { useId, useState } from 'react';
import { replaceElements, replaceManyProblem } from '../editor/commands';
import type { ElementTarget } from '../editor/commands/replaceElement';
import { useCommandContext } from '../editor/useEditor';
import { getPath, setPath, type Field } from './fields';

type Target = Exclude<ElementTarget, { kind: 'project' }>;

/** Fields not edited together: each element's own name, notes and id, and optional sub-objects. */
const OWN = new Set(['label', 'notes', 'id']);

/** The fields every one of the lists has (same key, same kind of control). */
export function sharedFields(lists: readonly Field[][]): Field[] {
  const [first, ...rest] = lists;
  if (!first) return [];
  return first.filter((f) => f.type !== 'group' && !OWN.has(f.key) && rest.every((l) => l.some((g) => g.key === f.key && g.type === f.type)));
}

const MIXED = '\u0000mixed';

/**
 * Edits the fields several selected elements share, in one undoable step. A field whose values
 * differ shows "mixed" until a value is chosen for all of them.
 */
export function MultiForm({ items, fields, what }: { items: { target: Target; value: object }[]; fields: Field[]; what: string }) {
  return (
    <div className="lw-form" data-testid="multi-form">
      {fields.length === 0 && <p className="lw-muted">These elements share no field that can be edited together.</p>}
      {fields.map((f) => <MultiRow key={f.key} field={f} items={items} what={what} />)}
    </div>
  );
}

function MultiRow({ field, items, what }: { field: Field; items: { target: Target; value: object }[]; what: string }) {
  const ctx = useCommandContext();
  const domId = useId();
  const [draft, setDraft] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const values = items.map((it) => getPath(it.value, field.key));
  const same = values.every((v) => JSON.stringify(v) === JSON.stringify(values[0]));
  const current = same ? values[0] : MIXED;
  const testId = `multi-${field.key}`;

  const commit = (value: unknown) => {
    const arg = { items: items.map((it) => ({ target: it.target, value: setPath(it.value, field.key, value) })), label: `Set ${field.label.toLowerCase()} of ${items.length} ${what}` };
    const problem = replaceManyProblem(arg);
    if (problem) {
      setError(problem);
      return false;
    }
    setError(null);
    replaceElements.run(ctx, arg);
    return true;
  };
  const err = error && <div className="lw-field-error" role="alert" data-testid={`error-${testId}`}>{error}</div>;

  if (field.type === 'checkbox') {
    return (
      <label className="lw-check" title={field.help}>
        <input
          type="checkbox"
          checked={current === true}
          ref={(el) => {
            if (el) el.indeterminate = current === MIXED;
          }}
          data-testid={testId}
          onChange={(e) => commit(e.target.checked)}
        />
        <span>{field.label}{current === MIXED ? ' (mixed)' : ''}</span>
        {err}
      </label>
    );
  }
  if (field.type === 'select') {
    const shown = current === MIXED ? MIXED : current === undefined ? '' : String(current);
    return (
      <div className="lw-field">
        <label htmlFor={domId}>{field.label}</label>
        <select
          id={domId}
          value={shown}
          data-testid={testId}
          onChange={(e) => {
            const raw = e.target.value;
            if (raw === MIXED) return;
            commit(raw === '' ? undefined : field.options.find((o) => String(o) === raw));
          }}
        >
          {current === MIXED && <option value={MIXED}>— mixed —</option>}
          {(field.optional || current === undefined) && <option value="">{field.emptyLabel ?? '— not given —'}</option>}
          {field.options.map((o) => <option key={String(o)} value={String(o)}>{field.optionLabels?.[String(o)] ?? String(o)}</option>)}
        </select>
        {err}
      </div>
    );
  }
  if (field.type === 'group') return null;
  const finish = () => {
    if (draft === null) return;
    const t = draft.trim();
    let value: unknown = draft;
    if (field.type === 'number') {
      if (t === '') value = undefined;
      else {
        const n = Number(t);
        if (!Number.isFinite(n)) {
          setError(`“${draft}” is not a number${field.unit ? ` of ${field.unit}` : ''}.`);
          return;
        }
        value = n;
      }
    } else if (t === '' && field.optional) value = undefined;
    if (commit(value)) setDraft(null);
  };
  const shown = draft ?? (current === MIXED || current === undefined || current === null ? '' : String(current));
  return (
    <div className={`lw-field${error ? ' has-error' : ''}`}>
      <label htmlFor={domId}>{field.type === 'number' && field.unit ? `${field.label} (${field.unit})` : field.label}</label>
      <input
        id={domId}
        type="text"
        value={shown}
        placeholder={current === MIXED ? 'mixed' : field.optional ? 'not given' : undefined}
        data-testid={testId}
        onChange={(e) => setDraft(e.target.value)}
        onBlur={finish}
        onKeyDown={(e) => {
          if (e.key === 'Enter') {
            e.preventDefault();
            finish();
          } else if (e.key === 'Escape') {
            setDraft(null);
            setError(null);
          }
        }}
      />
      {err}
    </div>
  );
}
