// The pool's worker entry (pool.ts): Node 20 ignores ESM loaders given in a Worker's
// execArgv (nodejs/node#47747), so the worker registers tsx itself, as bin/stovecard.js
// does, and then loads the TypeScript worker.
import { register } from 'tsx/esm/api';

register();
await import('./build-worker.ts');
