/**
 * Test helpers around the GDAL command-line tools (Debian `gdal-bin`), the
 * reference library of the terrain tests. GDAL-dependent suites run when
 * `gdal_viewshed` is on PATH; when it is absent they fail loudly, unless
 * KENNING_ALLOW_NO_GDAL=1 is set, in which case they report that they did
 * not run.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';

/** Whether `gdal_viewshed` (and so gdal-bin) is on PATH. */
export const gdalAvailable: boolean = (() => {
  // gdal_viewshed --version prints the version but exits non-zero (no input given); only a missing binary errors.
  const probe = spawnSync('gdal_viewshed', ['--version'], { encoding: 'utf8' });
  return probe.error === undefined && /GDAL \d/.test(probe.stdout + probe.stderr);
})();

/** `describe` that runs only with GDAL, and otherwise fails (or, when allowed, says it did not run). */
export function describeWithGdal(name: string, body: () => void): void {
  if (gdalAvailable) {
    describe(name, body);
    return;
  }
  describe(name, () => {
    if (process.env.KENNING_ALLOW_NO_GDAL === '1') {
      test('did NOT run: gdal_viewshed is absent (allowed by KENNING_ALLOW_NO_GDAL=1)', () => {
        console.warn(`${name}: GDAL reference checks did not run (gdal_viewshed not on PATH).`);
      });
    } else {
      test('gdal_viewshed is on PATH', () => {
        throw new Error(
          'gdal_viewshed not found on PATH. Install Debian gdal-bin (CI does), or set KENNING_ALLOW_NO_GDAL=1 to run without the GDAL reference checks.',
        );
      });
    }
  });
}

/** Runs a GDAL tool, returning stdout; throws with stderr on failure. */
export function gdal(tool: string, args: string[]): string {
  return execFileSync(tool, args, { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
}

/** A fresh temporary folder and a function that removes it. */
export function temporaryFolder(): { dir: string; remove: () => void } {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'kenning-terrain-'));
  return { dir, remove: () => rmSync(dir, { recursive: true, force: true }) };
}
