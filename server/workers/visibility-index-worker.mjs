// Worker-thread shim: registers tsx (see viewshed-worker.mjs) and loads the TypeScript entry.
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { register as registerCommonJs } from 'tsx/cjs/api';
import { register as registerModules } from 'tsx/esm/api';

const tsconfig = fileURLToPath(new URL('../../tsconfig.json', import.meta.url));
process.env.TSX_TSCONFIG_PATH ??= tsconfig;
registerCommonJs();
registerModules({ tsconfig });
createRequire(import.meta.url)('./visibility-index-worker.ts');
