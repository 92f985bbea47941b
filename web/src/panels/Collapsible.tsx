import { useState, type ReactNode } from 'react';

/**
 * A side-panel section whose body folds away under its heading, so a 1366 × 768 screen keeps room
 * for what the user is working on. Panels added later use it too. The open state is remembered per
 * section in this browser.
 */
export function Collapsible(props: { id: string; title: ReactNode; className?: string; defaultOpen?: boolean; children: ReactNode; testId?: string }) {
  const key = `linewright.panel.${props.id}`;
  const [open, setOpen] = useState<boolean>(() => {
    const saved = readFlag(key);
    return saved ?? props.defaultOpen ?? true;
  });
  const toggle = () => {
    setOpen(!open);
    writeFlag(key, !open);
  };
  return (
    <section className={`lw-section ${props.className ?? ''}${open ? '' : ' is-folded'}`} aria-label={typeof props.title === 'string' ? props.title : undefined} data-testid={props.testId}>
      <h2>
        <button type="button" className="lw-fold" aria-expanded={open} onClick={toggle} data-testid={`fold-${props.id}`}>
          <span className="lw-fold-mark" aria-hidden="true">{open ? '▾' : '▸'}</span>
          {props.title}
        </button>
      </h2>
      {open && props.children}
    </section>
  );
}

function readFlag(key: string): boolean | null {
  try {
    const v = window.localStorage.getItem(key);
    return v === null ? null : v === '1';
  } catch {
    return null;
  }
}

function writeFlag(key: string, v: boolean): void {
  try {
    window.localStorage.setItem(key, v ? '1' : '0');
  } catch {
    // Private mode or a full store: the section just forgets its state.
  }
}
