import { createContext, useContext, useSyncExternalStore } from 'react';
import type { CommandContext } from './commands/types';
import type { EditorState } from './store';

export const EditorContext = createContext<CommandContext | null>(null);

/** The command context: store, canvas, clipboard, download. */
export function useCommandContext(): CommandContext {
  const ctx = useContext(EditorContext);
  if (!ctx) throw new Error('useCommandContext outside <EditorContext>');
  return ctx;
}

/** Subscribes to one slice of the editor state; re-renders only when it changes (by identity). */
export function useEditorState<T>(select: (s: EditorState) => T): T {
  const { store } = useCommandContext();
  return useSyncExternalStore(store.subscribe, () => select(store.getState()));
}
