import { type MapFrame, gridValues, roundStep, toPaper } from './map-frame';
import { type ClassLayer, type Hillshade, type PrintPalette, mapPicture } from './map-picture';
import { INK, MUTED, type ReportDocument } from './pdf-layout';
import { formatDistance, printable } from './report-text';

/** What a printed map draws over its raster, in grid metres. */
export interface MapOverlays {
  boundary: [number, number][] | null;
  zones: { name: string; ring: [number, number][] }[];
  posts: {
    name: string;
    x: number;
    y: number;
    /** Viewing sector as grid bearings, radians, or null for all round. */
    sector: { fromRad: number; toRad: number } | null;
    /** Sector wedge and ring radius, metres. */
    reachM: number | null;
  }[];
  /** Numbered points (blind areas), grid metres. */
  marks?: { x: number; y: number; label: string }[];
  /** Range rings around one point (the crew card): metres and a label each. */
  rings?: { x: number; y: number; radii: { m: number; label: string }[] } | null;
}

/** Print resolution of the raster, pixels per point (1.5 ≈ 108 dpi, finer than the cells at the scales printed). */
const PIXELS_PER_POINT = 1.5;

/**
 * Draws one map into `frame.box`: the raster (hillshade and a coverage layer),
 * the boundary, zones, posts and sectors, grid ticks with coordinates on the
 * frame, a north arrow (true north, `gridConvergenceRad` at the middle), the
 * scale bar and the stated scale under it, and the layer's legend. Returns
 * the y below everything drawn.
 */
export function drawMap(
  r: ReportDocument,
  args: {
    frame: MapFrame;
    hillshade: Hillshade | null;
    layer?: { raster: ClassLayer; palette: PrintPalette } | null;
    overlays: MapOverlays;
    gridConvergenceRad: number;
    /** For the note under the map, e.g. "WGS 84 / UTM zone 33N (EPSG:32633)". */
    crsLabel: string;
    paperName: string;
  },
): number {
  const { doc } = r;
  const { frame, overlays } = args;
  const { x, y, width, height } = frame.box;
  const picture = mapPicture({
    extent: frame.extent,
    widthPx: Math.round(width * PIXELS_PER_POINT),
    heightPx: Math.round(height * PIXELS_PER_POINT),
    hillshade: args.hillshade,
    layer: args.layer ?? null,
  });
  doc.image(picture, x, y, { width, height });

  doc.save();
  doc.rect(x, y, width, height).clip();
  const path = (ring: [number, number][]) => {
    ring.forEach(([gx, gy], i) => {
      const [px, py] = toPaper(frame, gx, gy);
      if (i === 0) doc.moveTo(px, py);
      else doc.lineTo(px, py);
    });
    doc.closePath();
  };
  for (const zone of overlays.zones) {
    path(zone.ring);
    doc.lineWidth(1.1).dash(4, { space: 2.5 }).strokeColor(INK).stroke().undash();
  }
  if (overlays.boundary) {
    path(overlays.boundary);
    doc.lineWidth(1.6).strokeColor('#FFFFFF').stroke();
    path(overlays.boundary);
    doc.lineWidth(0.9).strokeColor(INK).stroke();
  }
  if (overlays.rings) {
    const [cx, cy] = toPaper(frame, overlays.rings.x, overlays.rings.y);
    overlays.rings.radii.forEach((ring, i) => {
      const radius = ring.m / frame.metresPerPoint;
      doc
        .circle(cx, cy, radius)
        .lineWidth(0.9)
        .dash(i % 2 === 0 ? 5 : 2, { space: 2 })
        .strokeColor(INK)
        .stroke()
        .undash();
      // Centred just inside the ring's northern edge, so it stays on the map.
      doc.font('bold').fontSize(6.5);
      const w = doc.widthOfString(printable(ring.label));
      label(r, ring.label, cx - w / 2, cy - radius + 3, 6.5);
    });
  }
  for (const zone of overlays.zones) {
    const n = zone.ring.length;
    if (n === 0) continue;
    const [zx, zy] = toPaper(frame, zone.ring.reduce((s, p) => s + p[0], 0) / n, zone.ring.reduce((s, p) => s + p[1], 0) / n);
    label(r, zone.name, zx - 20, zy - 4, 6.5, 'italic');
  }
  for (const mark of overlays.marks ?? []) {
    const [mx, my] = toPaper(frame, mark.x, mark.y);
    doc.circle(mx, my, 5).lineWidth(0.8).fillAndStroke('#FFFFFF', INK);
    doc
      .font('bold')
      .fontSize(6)
      .fillColor(INK)
      .text(mark.label, mx - 5, my - 3, { width: 10, align: 'center', lineBreak: false });
  }
  for (const post of overlays.posts) {
    const [px, py] = toPaper(frame, post.x, post.y);
    if (post.sector && post.reachM) {
      const radius = post.reachM / frame.metresPerPoint;
      const from = post.sector.fromRad;
      let to = post.sector.toRad;
      if (to <= from) to += 2 * Math.PI;
      doc.moveTo(px, py);
      const steps = Math.max(8, Math.ceil(((to - from) * 180) / Math.PI / 5));
      for (let s = 0; s <= steps; s++) {
        const a = from + ((to - from) * s) / steps;
        doc.lineTo(px + radius * Math.sin(a), py - radius * Math.cos(a));
      }
      doc.closePath().lineWidth(0.8).dash(1.5, { space: 1.5 }).strokeColor(INK).stroke().undash();
    }
    doc
      .polygon([px, py - 5.5], [px + 4.8, py + 3], [px - 4.8, py + 3])
      .lineWidth(1)
      .fillAndStroke(INK, '#FFFFFF');
    // Beside the marker, on its left when the name would run off the frame.
    doc.font('bold').fontSize(7);
    const w = doc.widthOfString(printable(post.name));
    label(r, post.name, px + 6 + w > x + width - 2 ? px - 8 - w : px + 6, py - 4, 7);
  }
  doc.restore();
  doc.rect(x, y, width, height).lineWidth(0.8).strokeColor(INK).stroke();

  // Grid ticks with their coordinates (grid metres, whole kilometres where the step allows).
  // About one labelled tick per 60 points, so the labels never run into each other.
  const step = roundStep(frame.extent.east - frame.extent.west, Math.max(2, Math.floor(width / 60)));
  doc.font('body').fontSize(6.5).fillColor(MUTED);
  const tickText = (v: number) => (step >= 1000 ? `${Math.round(v / 1000)} km` : `${Math.round(v)} m`);
  for (const e of gridValues(frame.extent.west, frame.extent.east, step)) {
    const [px] = toPaper(frame, e, frame.extent.north);
    doc
      .moveTo(px, y)
      .lineTo(px, y + 5)
      .moveTo(px, y + height)
      .lineTo(px, y + height - 5)
      .lineWidth(0.7)
      .strokeColor(INK)
      .stroke();
    // Labels whose text would stick out past the frame's corners are left out (the tick stays).
    if (px - x > 24 && x + width - px > 24) {
      doc.text(`E ${tickText(e)}`, px - 30, y + height + 2, { width: 60, align: 'center', lineBreak: false });
    }
  }
  for (const n of gridValues(frame.extent.south, frame.extent.north, step)) {
    const [, py] = toPaper(frame, frame.extent.west, n);
    doc
      .moveTo(x, py)
      .lineTo(x + 5, py)
      .moveTo(x + width, py)
      .lineTo(x + width - 5, py)
      .lineWidth(0.7)
      .strokeColor(INK)
      .stroke();
    if (py - y > 30 && y + height - py > 30) {
      doc.save();
      doc.rotate(-90, { origin: [x - 3, py] });
      doc.text(`N ${tickText(n)}`, x - 33, py - 7, { width: 60, align: 'center', lineBreak: false });
      doc.restore();
    }
  }

  northArrow(r, x + width - 22, y + 30, args.gridConvergenceRad);

  // Scale bar: four segments, alternately filled; under it the stated scale and the grid.
  const barM = roundStep((width * frame.metresPerPoint) / 3, 1);
  const barPt = barM / frame.metresPerPoint;
  const barY = y + height + 14;
  for (let i = 0; i < 4; i++) {
    const segX = x + (i * barPt) / 4;
    doc.rect(segX, barY, barPt / 4, 4).lineWidth(0.6);
    if (i % 2 === 0) doc.fillAndStroke(INK, INK);
    else doc.fillAndStroke('#FFFFFF', INK);
  }
  doc.font('body').fontSize(6.5).fillColor(INK);
  doc.text('0', x - 2, barY + 5, { lineBreak: false });
  doc.text(formatDistance(barM), x + barPt - 20, barY + 5, { width: 40, align: 'center', lineBreak: false });
  doc
    .font('bold')
    .fontSize(7.5)
    .text(
      `Scale 1 : ${frame.scale.toLocaleString('en-GB').replace(/,/g, ' ')} printed at 100 % on ${args.paperName}`,
      x + barPt + 24,
      barY - 1,
      {
        width: Math.max(60, width - barPt - 24),
        lineBreak: false,
        ellipsis: true,
      },
    );
  doc
    .font('body')
    .fontSize(6.5)
    .fillColor(MUTED)
    .text(printable(`Grid ${args.crsLabel}, ticks every ${formatDistance(step)}. Arrow: true north.`), x, barY + 14, {
      width,
      lineBreak: false,
      ellipsis: true,
    });
  let bottom = barY + 24;

  if (args.layer) bottom = legend(r, args.layer.palette, x, bottom + 2, width);
  doc.fillColor(INK).font('body').fontSize(9);
  doc.x = r.margin;
  doc.y = bottom + 6;
  return doc.y;
}

/** Text on a white patch so it reads over the raster. */
function label(r: ReportDocument, text: string, x: number, y: number, size: number, font = 'bold') {
  const { doc } = r;
  doc.font(font).fontSize(size);
  const t = printable(text);
  const w = doc.widthOfString(t);
  doc.save();
  doc
    .rect(x - 1.5, y - 0.5, w + 3, size + 2)
    .fillOpacity(0.8)
    .fill('#FFFFFF');
  doc.restore();
  doc.fillColor(INK).font(font).text(t, x, y, { lineBreak: false });
}

function northArrow(r: ReportDocument, cx: number, cy: number, gridConvergenceRad: number) {
  const { doc } = r;
  // Grid bearing of true north is −γ.
  const b = -gridConvergenceRad;
  const ux = Math.sin(b);
  const uy = -Math.cos(b);
  const len = 16;
  doc.save();
  doc.circle(cx, cy, 13).fillOpacity(0.85).fill('#FFFFFF');
  doc.restore();
  const tip: [number, number] = [cx + ux * len * 0.7, cy + uy * len * 0.7];
  const tail: [number, number] = [cx - ux * len * 0.5, cy - uy * len * 0.5];
  const side = (s: number): [number, number] => [tail[0] + -uy * 4.5 * s, tail[1] + ux * 4.5 * s];
  doc.polygon(tip, side(1), [cx - ux * 2, cy - uy * 2]).fill(INK);
  doc
    .polygon(tip, side(-1), [cx - ux * 2, cy - uy * 2])
    .lineWidth(0.6)
    .fillAndStroke('#FFFFFF', INK);
  doc
    .font('bold')
    .fontSize(7)
    .fillColor(INK)
    .text('N', tip[0] - 3, tip[1] - 9, { lineBreak: false });
}

/** The layer's classes as swatches in a row (wrapping). */
function legend(r: ReportDocument, palette: PrintPalette, x: number, y: number, width: number): number {
  const { doc } = r;
  doc.font('bold').fontSize(7).fillColor(INK).text(printable(palette.title), x, y, { lineBreak: false });
  let cx = x + doc.widthOfString(printable(palette.title)) + 10;
  let cy = y;
  doc.font('body').fontSize(7);
  for (const c of palette.classes) {
    const w = 14 + doc.widthOfString(printable(c.label)) + 12;
    if (cx + w > x + width) {
      cx = x;
      cy += 11;
    }
    if (c.rgb) {
      doc.rect(cx, cy, 9, 7).fill(hex(c.rgb));
      if (c.hatched) {
        doc.save();
        doc.rect(cx, cy, 9, 7).clip();
        for (let d = -7; d < 9; d += 3) doc.moveTo(cx + d, cy + 7).lineTo(cx + d + 7, cy);
        doc.lineWidth(0.6).strokeColor('#603C08').stroke();
        doc.restore();
      }
    }
    doc.rect(cx, cy, 9, 7).lineWidth(0.4).strokeColor(INK).stroke();
    doc.fillColor(INK).text(printable(c.label), cx + 12, cy, { lineBreak: false });
    cx += w;
  }
  return cy + 10;
}

const hex = (rgb: [number, number, number]) => `#${rgb.map((v) => v.toString(16).padStart(2, '0')).join('')}`;
