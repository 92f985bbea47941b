// The app's test hook (window.__linewright) and its types, declared once in the web source.
/// <reference path="../web/src/testHook.ts" />
