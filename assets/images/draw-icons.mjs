// Draws the app icon (1024 px) and the web favicon (48 px) from the Kenning mark
// (components/ui/logo.tsx: an eye above the earth's curve, its sight line touching the horizon)
// with pngjs. Run: node assets/images/draw-icons.mjs
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pngjs from 'pngjs';

const here = path.dirname(fileURLToPath(import.meta.url));
const hex = (h) => [1, 3, 5].map((i) => parseInt(h.slice(i, i + 2), 16));
// Theme tokens (components/ui/theme.ts): night, railText, lantern.
const NIGHT = hex('#17252B');
const EARTH = hex('#C9D3D6');
const SIGHT = hex('#E8B04A');

// The mark in its 40 × 40 viewBox, shrunk to 80 % about the middle.
const mark = (x, y) => [4 + 0.8 * x, 4 + 0.8 * y];
const curve = [];
for (let i = 0; i <= 64; i++) {
  const t = i / 64;
  const x = (1 - t) ** 2 * 2 + 2 * (1 - t) * t * 20 + t ** 2 * 38;
  const y = (1 - t) ** 2 * 34 + 2 * (1 - t) * t * 22 + t ** 2 * 34;
  curve.push(mark(x, y));
}
const sightFrom = mark(7, 9);
const sightTo = mark(36, 26);
const eye = mark(7, 9);

function segmentDistance(px, py, [ax, ay], [bx, by]) {
  const dx = bx - ax;
  const dy = by - ay;
  const t = Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(px - ax - t * dx, py - ay - t * dy);
}

function roundedRectDistance(px, py, size, radius) {
  const qx = Math.abs(px - size / 2) - (size / 2 - radius);
  const qy = Math.abs(py - size / 2) - (size / 2 - radius);
  return Math.hypot(Math.max(qx, 0), Math.max(qy, 0)) + Math.min(Math.max(qx, qy), 0) - radius;
}

function draw(sizePx, file) {
  const png = new pngjs.PNG({ width: sizePx, height: sizePx });
  const unit = 40 / sizePx; // viewBox units per pixel
  const cover = (distance, halfWidth) => Math.max(0, Math.min(1, 0.5 - (distance - halfWidth) / unit));
  for (let row = 0; row < sizePx; row++) {
    for (let col = 0; col < sizePx; col++) {
      const x = (col + 0.5) * unit;
      const y = (row + 0.5) * unit;
      let rgb = NIGHT;
      const blend = (color, a) => {
        rgb = rgb.map((c, i) => c + (color[i] - c) * a);
      };
      let dCurve = Infinity;
      for (let i = 1; i < curve.length; i++) dCurve = Math.min(dCurve, segmentDistance(x, y, curve[i - 1], curve[i]));
      blend(EARTH, cover(dCurve, 1.2));
      blend(SIGHT, cover(segmentDistance(x, y, sightFrom, sightTo), 0.96));
      blend(SIGHT, cover(Math.hypot(x - eye[0], y - eye[1]), 3.2));
      const alpha = cover(roundedRectDistance(x, y, 40, 7), 0);
      const o = (row * sizePx + col) * 4;
      png.data[o] = Math.round(rgb[0]);
      png.data[o + 1] = Math.round(rgb[1]);
      png.data[o + 2] = Math.round(rgb[2]);
      png.data[o + 3] = Math.round(alpha * 255);
    }
  }
  writeFileSync(path.join(here, file), pngjs.PNG.sync.write(png));
}

draw(1024, 'icon.png');
draw(48, 'favicon.png');
// The installed web app's icons (its manifest, written at build time by server/scripts/field-mode-web.ts).
draw(192, 'icon-192.png');
draw(512, 'icon-512.png');
