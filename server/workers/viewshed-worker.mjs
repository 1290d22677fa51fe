// Worker-thread shim: registers tsx (with the repository's tsconfig, for the
// `@/…` import alias) and then loads the TypeScript worker entry. Plain Node
// cannot start a worker from a .ts file, and `execArgv: ['--import', 'tsx']`
// does not reach the worker's first module on Node 20.
import { fileURLToPath } from 'node:url';
import { register } from 'tsx/esm/api';

register({ tsconfig: fileURLToPath(new URL('../../tsconfig.json', import.meta.url)) });
await import('./viewshed-worker.ts');
