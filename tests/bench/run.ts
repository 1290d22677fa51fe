/**
 * `npm run bench`: speed figures, printed as a table. Nothing here passes or
 * fails; the numbers go into closing notes and DEVELOPERS.md.
 */
import { existsSync } from 'node:fs';
import path from 'node:path';
import { benchApi } from './api.bench';
import { benchFixes } from './fixes.bench';
import { benchLists } from './lists.bench';
import { benchSightline } from './sightline.bench';
import { benchTerrain } from './terrain.bench';
import { type BenchRow } from './measure';

const print = (title: string, rows: BenchRow[]) => {
  console.log(`\n${title}`);
  for (const r of rows) {
    const v = r.value >= 100 ? Math.round(r.value).toLocaleString('en') : r.value.toPrecision(3);
    console.log(`  ${r.name.padEnd(58)} ${v.padStart(12)} ${r.unit}${r.detail ? `   (${r.detail})` : ''}`);
  }
};

async function main() {
  const only = process.argv[2];
  if (!only || only === 'sightline') {
    print(
      'Sightline core',
      (await benchSightline()).map((r) => ({ name: r.name, value: r.opsPerSec, unit: 'ops/s' })),
    );
  }
  if (!only || only === 'fixes') {
    print(
      'Bearing fixes',
      (await benchFixes()).map((r) => ({ name: r.name, value: r.opsPerSec, unit: 'ops/s' })),
    );
  }
  if ((!only || only === 'api') && process.env.KENNING_BENCH_APP_DATABASE_URL && process.env.KENNING_BENCH_FILES_DIR) {
    print(
      'The API as production runs it, on loopback (autocannon in this process; medians, see tests/bench/api.bench.ts)',
      await benchApi(process.env.KENNING_BENCH_APP_DATABASE_URL, process.env.KENNING_BENCH_FILES_DIR),
    );
  }
  if ((!only || only === 'lists') && process.env.KENNING_BENCH_DATABASE_URL) {
    print(
      'List pages with 1 000 posts on a site (autocannon, 4 connections, 4 s each)',
      await benchLists(process.env.KENNING_BENCH_DATABASE_URL),
    );
  }
  if (!only || only === 'siting') {
    const { benchSiting } = await import('./siting.bench');
    print('Tower siting: the choice alone (100 candidates × 3 heights, 2000², one condition)', await benchSiting());
  }
  const viewshed = path.join(__dirname, 'viewshed.bench.ts');
  if ((!only || only === 'viewshed') && existsSync(viewshed)) {
    // Imported by path: the terrain benchmark may not exist on older checkouts.
    const mod = (await import(viewshed)) as { benchViewshed: () => Promise<BenchRow[]> };
    print('Viewshed engine', await mod.benchViewshed());
  }
  const coverage = path.join(__dirname, 'coverage.bench.ts');
  if ((!only || only === 'coverage') && existsSync(coverage)) {
    const mod = (await import(coverage)) as { benchCoverage: () => Promise<BenchRow[]> };
    print('Network coverage (10 posts, 2000², after the viewsheds)', await mod.benchCoverage());
  }
  if (!only || only === 'heatmap') {
    const { benchVisibilityIndex } = await import('./visibility-index.bench');
    print('Visibility index (the siting heat map)', await benchVisibilityIndex());
  }
  if (!only || only === 'plan') {
    const { benchPlanCoverage } = await import('./plan-coverage.bench');
    print('A plan coverage run as the worker computes it', await benchPlanCoverage());
  }
  if (!only || only === 'terrain') {
    print('Terrain: hillshade, profile, upload ingest', await benchTerrain());
  }
  if ((!only || only === 'reports') && process.env.KENNING_BENCH_DATABASE_URL && process.env.KENNING_BENCH_FILES_DIR) {
    const { benchReports } = await import('./reports.bench');
    print(
      'Printed reports (PDF, pdfkit): the demo forest plan package and a crew card',
      await benchReports(process.env.KENNING_BENCH_DATABASE_URL, process.env.KENNING_BENCH_FILES_DIR),
    );
  }
  if ((!only || only === 'web') && process.env.KENNING_BENCH_DATABASE_URL) {
    const { benchWeb } = await import('./web.bench');
    print(
      'First screens of the built web app (headless Chromium, 390×844, loopback, empty cache)',
      await benchWeb(process.env.KENNING_BENCH_DATABASE_URL),
    );
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
