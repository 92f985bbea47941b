// Worker threads do not inherit tsx's loader: register it here, then run the TypeScript worker.
import { register } from 'tsx/esm/api';

register();
await import('./worker.ts');
