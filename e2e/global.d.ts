// The app's test hook (window.__linewright) and its types, declared once in the web source.
export type { TestHook } from '../web/src/testHook';
