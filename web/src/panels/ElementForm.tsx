import { useEffect, useId, useRef, useState, type KeyboardEvent } from 'react';
import { parseElement, replaceElement } from '../editor/commands';
import type { ElementTarget } from '../editor/commands/replaceElement';
import { useCommandContext } from '../editor/useEditor';
import { getPath, setPath, type Field } from './fields';

interface Props {
  target: ElementTarget;
  value: object;
  fields: Field[];
}

/**
 * Edits one element field by field. Every change is validated with the core
 * zod schema for the whole element; an invalid value stays in the field with
 * the reason beside it and never reaches the document.
 */
export function ElementForm({ target, value, fields }: Props) {
  return (
    <div className="lw-form" data-testid="details-form">
      {fields.map((f) => (
        <FieldRow key={f.key} field={f} target={target} element={value} />
      ))}
    </div>
  );
}

function fieldName(f: Field): string {
  return f.type === 'number' && f.unit ? `${f.label} (${f.unit})` : f.label;
}

/** Issues for this field's path; when the schema says nothing about it but still fails, the first issue. */
function problemFor(target: ElementTarget, candidate: unknown, key: string): string | null {
  const r = parseElement(target, candidate);
  if (r.ok) return null;
  const mine = r.issues.find((i) => i.path === key || i.path.startsWith(key + '.'));
  const any = mine ?? r.issues[0]!;
  return any.path && any.path !== key ? `${any.path}: ${any.message}` : any.message;
}

function FieldRow({ field, target, element }: { field: Field; target: ElementTarget; element: object }) {
  const ctx = useCommandContext();
  const domId = useId();
  const current = getPath(element, field.key);
  const [draft, setDraft] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const cancelled = useRef(false);

  // A change from elsewhere (undo, a fix) replaces a stale error.
  useEffect(() => {
    setError(null);
  }, [current]);

  const commit = (candidate: unknown, what: string) => {
    replaceElement.run(ctx, { target, value: candidate, label: `Set ${what}` });
  };

  /** Text → value for this field, or an error message. */
  const convert = (raw: string): { ok: true; value: unknown } | { ok: false; message: string } => {
    if (field.type === 'number') {
      const t = raw.trim();
      if (t === '') return field.optional ? { ok: true, value: undefined } : { ok: false, message: 'Required: enter a number.' };
      const n = Number(t);
      if (!Number.isFinite(n)) return { ok: false, message: `“${raw}” is not a number${field.unit ? ` of ${field.unit}` : ''}.` };
      if (field.integer && !Number.isInteger(n)) return { ok: false, message: 'Enter a whole number.' };
      return { ok: true, value: n };
    }
    if ('optional' in field && field.optional && raw.trim() === '') return { ok: true, value: undefined };
    return { ok: true, value: raw };
  };

  const check = (raw: string): { candidate: unknown; message: string | null } => {
    const v = convert(raw);
    if (!v.ok) return { candidate: null, message: v.message };
    const candidate = setPath(element, field.key, v.value);
    return { candidate, message: problemFor(target, candidate, field.key) };
  };

  const finishText = () => {
    if (cancelled.current) {
      cancelled.current = false;
      return;
    }
    if (draft === null) return;
    const { candidate, message } = check(draft);
    if (message) {
      setError(message);
      return;
    }
    setDraft(null);
    setError(null);
    commit(candidate, fieldName(field).toLowerCase());
  };

  const onKey = (e: KeyboardEvent<HTMLInputElement | HTMLTextAreaElement>) => {
    if (e.key === 'Enter' && !(e.currentTarget instanceof HTMLTextAreaElement)) {
      e.preventDefault();
      finishText();
    } else if (e.key === 'Escape') {
      // Escape drops the draft: the field shows the document's value again.
      cancelled.current = true;
      setDraft(null);
      setError(null);
      e.currentTarget.blur();
    }
  };

  const errorId = `${domId}-err`;
  const describedBy = error ? errorId : undefined;
  const testId = `field-${field.key}`;

  if (field.type === 'group') {
    const present = current !== undefined;
    return (
      <fieldset className="lw-group">
        <label className="lw-check">
          <input
            type="checkbox"
            checked={present}
            data-testid={testId}
            onChange={(e) => commit(setPath(element, field.key, e.target.checked ? field.make() : undefined), field.label.toLowerCase())}
          />
          {field.label}
        </label>
        {present && field.fields.map((f) => <FieldRow key={f.key} field={f} target={target} element={element} />)}
      </fieldset>
    );
  }

  if (field.type === 'checkbox') {
    return (
      <label className="lw-check" title={field.help}>
        <input
          type="checkbox"
          checked={current === true}
          data-testid={testId}
          onChange={(e) => {
            const candidate = setPath(element, field.key, e.target.checked);
            const message = problemFor(target, candidate, field.key);
            if (message) setError(message);
            else commit(candidate, field.label.toLowerCase());
          }}
        />
        <span>{field.label}</span>
        {error && <span className="lw-field-error" role="alert">{error}</span>}
      </label>
    );
  }

  if (field.type === 'select') {
    const shown = current === undefined ? '' : String(current);
    const needed = field.needed !== undefined && current === undefined;
    return (
      <div className={`lw-field${needed ? ' is-needed' : ''}`}>
        <label htmlFor={domId}>{field.label}</label>
        <select
          id={domId}
          value={shown}
          data-testid={testId}
          aria-describedby={describedBy}
          onChange={(e) => {
            const raw = e.target.value;
            const opt = field.options.find((o) => String(o) === raw);
            const candidate = setPath(element, field.key, raw === '' ? undefined : opt);
            const message = problemFor(target, candidate, field.key);
            if (message) setError(message);
            else commit(candidate, field.label.toLowerCase());
          }}
        >
          {(field.optional || current === undefined) && <option value="">{field.emptyLabel ?? '— not given —'}</option>}
          {field.options.map((o) => (
            <option key={String(o)} value={String(o)}>
              {field.optionLabels?.[String(o)] ?? String(o)}
            </option>
          ))}
        </select>
        {needed && <div className="lw-field-needed" data-testid={`${testId}-needed`}>{field.needed}</div>}
        {field.help && <div className="lw-field-help">{field.help}</div>}
        {error && <div className="lw-field-error" id={errorId} role="alert">{error}</div>}
      </div>
    );
  }

  const shown = draft ?? (current === undefined || current === null ? '' : String(current));
  const common = {
    id: domId,
    value: shown,
    'data-testid': testId,
    'aria-invalid': error ? true : undefined,
    'aria-describedby': describedBy,
    onChange: (e: { target: { value: string } }) => {
      setDraft(e.target.value);
      setError(check(e.target.value).message);
    },
    onBlur: finishText,
    onKeyDown: onKey,
    placeholder: field.optional ? 'not given' : undefined,
  };
  return (
    <div className={`lw-field${error ? ' has-error' : ''}`}>
      <label htmlFor={domId}>{fieldName(field)}</label>
      {field.type === 'textarea' ? (
        <textarea rows={3} {...common} />
      ) : (
        <input type="text" inputMode={field.type === 'number' ? 'decimal' : undefined} autoComplete="off" spellCheck={field.type === 'text'} {...common} />
      )}
      {field.help && <div className="lw-field-help">{field.help}</div>}
      {error && <div className="lw-field-error" id={errorId} role="alert" data-testid={`error-${field.key}`}>{error}</div>}
    </div>
  );
}
