/**
 * Command line: writes the brotli and gzip copies of the web build's scripts
 * that `precompressedAssets` sends (run after `expo export` by `npm run
 * build:web` and the bootstrap). Usage: `node --import tsx server/scripts/precompress-web.ts dist/web`
 */
import { precompressWeb } from '../http/precompressed-assets';

const dir = process.argv[2] ?? 'dist/web';
const t = precompressWeb(dir);
const kib = (n: number) => `${(n / 1024).toFixed(0)} KiB`;
console.log(`precompressed ${dir}: ${kib(t.raw)} of scripts → brotli ${kib(t.br)}, gzip ${kib(t.gz)}`);
