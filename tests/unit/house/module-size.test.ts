/**
 * House rule from issue 14: no source file outside the tests runs past 300 lines unless its first line says why
 * (`// Over 300 lines: …`). Size has to be earned; the reason is the place a reader checks that it is.
 * Source: issue 14 ("no file outside tests over 300 lines without a one-line reason at its top");
 * the limit itself is common practice, no source.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';

const ROOT = join(__dirname, '..', '..', '..');
const FOLDERS = ['app', 'components', 'scenes', 'server', 'shared'];
const SOURCE = /\.(ts|tsx|js|mjs|cjs)$/;
const LIMIT = 300;
const REASON = /^\/\/ Over 300 lines: \S.{10,}/;

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (name === 'node_modules' || name.startsWith('.')) return [];
    if (statSync(path).isDirectory()) return sourceFiles(path);
    return SOURCE.test(name) ? [path] : [];
  });
}

/** The files over the limit whose first line gives no reason, as paths from the repo root. */
export function unexplainedLongFiles(files: Array<{ path: string; text: string }>): string[] {
  return files
    .filter(({ text }) => text.split('\n').length - (text.endsWith('\n') ? 1 : 0) > LIMIT)
    .filter(({ text }) => !REASON.test(text.split('\n', 1)[0]!))
    .map(({ path }) => path);
}

describe('module size', () => {
  it('tells a long file without a reason from a short one and from a long one with a reason', () => {
    const long = Array.from({ length: LIMIT + 1 }, (_, i) => `export const a${i} = ${i};`).join('\n');
    const short = long.split('\n').slice(0, LIMIT).join('\n');
    expect(
      unexplainedLongFiles([
        { path: 'long.ts', text: long },
        { path: 'short.ts', text: short },
        { path: 'reasoned.ts', text: `// Over 300 lines: one table read in one pass.\n${long}` },
        { path: 'vague.ts', text: `// Over 300 lines: ok\n${long}` },
      ]),
    ).toEqual(['long.ts', 'vague.ts']);
  });

  it('every source file outside the tests over 300 lines says why on its first line', () => {
    const files = FOLDERS.flatMap((folder) => sourceFiles(join(ROOT, folder))).map((path) => ({
      path: relative(ROOT, path),
      text: readFileSync(path, 'utf8'),
    }));
    expect(files.length).toBeGreaterThan(100);
    expect(unexplainedLongFiles(files)).toEqual([]);
  });
});
