// Worker-thread shim: registers tsx's CommonJS and ES-module hooks (with the
// repository's tsconfig, for the `@/…` import alias) and then loads the
// TypeScript worker entry. Plain Node cannot start a worker from a .ts file,
// and a parent started without tsx (Jest, plain node) passes no hooks down.
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { register as registerCommonJs } from 'tsx/cjs/api';
import { register as registerModules } from 'tsx/esm/api';

const tsconfig = fileURLToPath(new URL('../../tsconfig.json', import.meta.url));
process.env.TSX_TSCONFIG_PATH ??= tsconfig;
registerCommonJs();
registerModules({ tsconfig });
createRequire(import.meta.url)('./viewshed-worker.ts');
