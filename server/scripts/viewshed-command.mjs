// The viewshed command line with no TypeScript compiled at run time: `npm run viewshed` starts this file,
// which runs dist/cli/viewshed.cjs — server/scripts/viewshed.ts and its second thread's entry bundled by
// esbuild (the one tsx itself uses) — and makes that bundle first when it is missing or older than any file
// it was built from (listed in dist/cli/viewshed-meta.json; a few dozen stat calls). Starting through tsx
// instead costs ≈ 0.2 s of CPU for loading tsx and compiling the sources on every run. Without esbuild the
// TypeScript entry runs through tsx as before.
import { existsSync, mkdirSync, mkdtempSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..', '..');
const outDir = path.join(root, 'dist', 'cli');
const bundle = path.join(outDir, 'viewshed.cjs');
const workerBundle = path.join(outDir, 'viewshed-half-worker.cjs');
const metaFile = path.join(outDir, 'viewshed-meta.json');
const require = createRequire(import.meta.url);

/** Whether the bundle is missing or older than one of its inputs. */
function stale() {
  if (!existsSync(bundle) || !existsSync(workerBundle) || !existsSync(metaFile)) return true;
  const built = Math.min(statSync(bundle).mtimeMs, statSync(workerBundle).mtimeMs);
  const { inputs } = JSON.parse(readFileSync(metaFile, 'utf8'));
  return Object.keys(inputs).some((input) => {
    const file = path.resolve(root, input);
    return !existsSync(file) || statSync(file).mtimeMs > built;
  });
}

/** Bundles both entries into a fresh folder, then moves the files into place (each rename is atomic). */
function build(esbuild) {
  mkdirSync(outDir, { recursive: true });
  const scratch = mkdtempSync(path.join(outDir, '.build-'));
  try {
    const result = esbuild.buildSync({
      absWorkingDir: root,
      entryPoints: {
        viewshed: 'server/scripts/viewshed.ts',
        'viewshed-half-worker': 'server/scripts/viewshed-half-worker.ts',
      },
      outdir: scratch,
      outExtension: { '.js': '.cjs' },
      bundle: true,
      platform: 'node',
      format: 'cjs',
      target: 'node20',
      tsconfig: path.join(root, 'tsconfig.json'),
      metafile: true,
      logLevel: 'error',
    });
    const meta = path.join(scratch, 'viewshed-meta.json');
    writeFileSync(meta, JSON.stringify({ inputs: result.metafile.inputs }));
    renameSync(path.join(scratch, 'viewshed-half-worker.cjs'), workerBundle);
    renameSync(path.join(scratch, 'viewshed.cjs'), bundle);
    renameSync(meta, metaFile);
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}

function loadEsbuild() {
  try {
    return require('esbuild');
  } catch {
    return null;
  }
}

if (!stale()) {
  require(bundle);
} else {
  const esbuild = loadEsbuild();
  if (esbuild !== null) {
    build(esbuild);
    require(bundle);
  } else {
    const tsconfig = path.join(root, 'tsconfig.json');
    process.env.TSX_TSCONFIG_PATH ??= tsconfig;
    const { register: registerCommonJs } = await import('tsx/cjs/api');
    const { register: registerModules } = await import('tsx/esm/api');
    registerCommonJs();
    registerModules({ tsconfig });
    require('./viewshed.ts');
  }
}
