// Worker-thread shim for the viewshed command line run through tsx (as the
// tests run it): registers tsx's hooks with the repository's tsconfig, then
// loads the TypeScript entry. The prebuilt command line
// (`viewshed-command.mjs`) starts its bundled worker instead.
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { register as registerCommonJs } from 'tsx/cjs/api';
import { register as registerModules } from 'tsx/esm/api';

const tsconfig = fileURLToPath(new URL('../../tsconfig.json', import.meta.url));
process.env.TSX_TSCONFIG_PATH ??= tsconfig;
registerCommonJs();
registerModules({ tsconfig });
createRequire(import.meta.url)('./viewshed-half-worker.ts');
