import { PNG } from 'pngjs';

/**
 * A 640 × 480 picture of a ridge line under a sky, written by pngjs, with film
 * grain from a fixed pseudo-random sequence so it does not compress to nothing
 * (a few hundred kB, enough for the upload to take visible time when throttled).
 */
export function ridgePng(): Buffer {
  const [w, h] = [640, 480];
  const png = new PNG({ width: w, height: h });
  let seed = 12345;
  const grain = () => {
    seed = (seed * 1103515245 + 12345) % 2147483648; // the ANSI C example LCG
    return (seed / 2147483648 - 0.5) * 24;
  };
  for (let y = 0; y < h; y++) {
    for (let x = 0; x < w; x++) {
      const ridge = 300 + 50 * Math.sin(x / 60) + 20 * Math.sin(x / 14);
      const px = y < ridge ? [150 + y / 6, 185 + y / 8, 225] : [60, 95 - (y - ridge) / 8, 55];
      png.data.set([...px.map((v) => Math.max(0, Math.min(255, Math.round(v + grain())))), 255], (y * w + x) * 4);
    }
  }
  return PNG.sync.write(png);
}
