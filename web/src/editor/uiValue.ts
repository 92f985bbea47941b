import { useSyncExternalStore } from 'react';

/**
 * One value of the editor's chrome kept outside the document (a dialog open or not, what it shows),
 * read by components through `use()` and changed by `set()` from anywhere, a command or a button.
 */
export function uiValue<T>(initial: T): { set(v: T): void; use(): T } {
  let value = initial;
  const listeners = new Set<() => void>();
  const subscribe = (l: () => void) => {
    listeners.add(l);
    return () => listeners.delete(l);
  };
  const get = () => value;
  return {
    set(v: T) {
      value = v;
      for (const l of listeners) l();
    },
    use: () => useSyncExternalStore(subscribe, get),
  };
}
