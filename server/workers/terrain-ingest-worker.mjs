// Worker-thread shim for the terrain ingest (see viewshed-worker.mjs): registers
// tsx with the repository's tsconfig, then loads the TypeScript entry.
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { register as registerCommonJs } from 'tsx/cjs/api';
import { register as registerModules } from 'tsx/esm/api';

const tsconfig = fileURLToPath(new URL('../../tsconfig.json', import.meta.url));
process.env.TSX_TSCONFIG_PATH ??= tsconfig;
registerCommonJs();
registerModules({ tsconfig });
createRequire(import.meta.url)('./terrain-ingest-worker.ts');
