#!/usr/bin/env node
/**
 * Draws Headroom's add-in icon and writes assets/icon-<size>.png for every size the manifest uses.
 *
 * The artwork: a water drop standing in front of a rising gauge line (supply pressure climbing to meet demand),
 * on a deep-blue rounded tile. It is described as a few shapes in a unit square (0..1 on both axes, y down) and
 * rasterised with SIZE × SIZE pixels, each pixel the average of SS × SS sub-samples, so small sizes stay crisp.
 *
 *   node assets/make-icons.mjs          write the PNGs next to this script
 *   node assets/make-icons.mjs --check  exit 1 if a committed PNG differs from what this script draws
 *
 * `renderIcon(size)` and `decodePng(file)` are exported so a test can compare the committed files with the drawing,
 * pixel by pixel (types in make-icons.d.mts).
 */
import { readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { PNG } from "pngjs";

export const ICON_SIZES = [16, 32, 64, 80, 128];

const TILE = [14, 74, 110]; // deep blue
const LINE = [245, 166, 35]; // amber gauge line
const DROP = [127, 211, 247]; // light water blue
const SHINE = [236, 249, 255]; // highlight on the drop

const TILE_RADIUS = 0.2;
const GAUGE = [
  [0.12, 0.84],
  [0.42, 0.7],
  [0.88, 0.3],
];
const GAUGE_HALF_WIDTH = 0.055;
const DROP_CENTRE = [0.5, 0.58];
const DROP_RADIUS = 0.23;
const DROP_TIP_Y = 0.13;
const DROP_GAP = 0.05; // tile-coloured margin that separates the drop from the line behind it

function insideTile(x, y) {
  const r = TILE_RADIUS;
  const qx = Math.max(Math.abs(x - 0.5) - (0.5 - r), 0);
  const qy = Math.max(Math.abs(y - 0.5) - (0.5 - r), 0);
  return x >= 0 && x <= 1 && y >= 0 && y <= 1 && qx * qx + qy * qy <= r * r;
}

function distanceToSegment(px, py, [ax, ay], [bx, by]) {
  const dx = bx - ax;
  const dy = by - ay;
  const t = Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(px - (ax + t * dx), py - (ay + t * dy));
}

function onGauge(x, y) {
  for (let i = 0; i + 1 < GAUGE.length; i++) {
    if (distanceToSegment(x, y, GAUGE[i], GAUGE[i + 1]) <= GAUGE_HALF_WIDTH) return true;
  }
  return false;
}

/** The drop grown by `grow`: a circle plus the triangle from the tip to the circle's two tangent points. */
function insideDrop(x, y, grow) {
  const [cx, cy] = DROP_CENTRE;
  const r = DROP_RADIUS + grow;
  if (Math.hypot(x - cx, y - cy) <= r) return true;
  const tipY = DROP_TIP_Y - grow;
  const d = cy - tipY; // tip straight above the centre
  if (y < tipY || y > cy) return false;
  const halfAngle = Math.asin(r / d);
  // Inside the cone from the tip if the angle from the axis is within the half-angle, and above the tangent chord.
  const vx = x - cx;
  const vy = y - tipY;
  const angle = Math.atan2(Math.abs(vx), vy);
  const chordY = tipY + Math.sqrt(d * d - r * r) * Math.cos(halfAngle);
  return angle <= halfAngle && y <= chordY;
}

function insideShine(x, y) {
  const ex = (x - 0.42) / 0.045;
  const ey = (y - 0.56) / 0.075;
  return ex * ex + ey * ey <= 1;
}

/** Colour of one sample point, or null where the icon is transparent. */
function sample(x, y) {
  if (!insideTile(x, y)) return null;
  if (insideDrop(x, y, 0)) return insideShine(x, y) ? SHINE : DROP;
  if (insideDrop(x, y, DROP_GAP)) return TILE;
  if (onGauge(x, y)) return LINE;
  return TILE;
}

/** RGBA pixels (Uint8Array, row-major, 4 bytes a pixel) of the icon at `size` × `size`. */
export function renderIcon(size) {
  const ss = size <= 32 ? 8 : 4;
  const out = new Uint8Array(size * size * 4);
  for (let py = 0; py < size; py++) {
    for (let px = 0; px < size; px++) {
      let r = 0;
      let g = 0;
      let b = 0;
      let covered = 0;
      for (let sy = 0; sy < ss; sy++) {
        for (let sx = 0; sx < ss; sx++) {
          const c = sample((px + (sx + 0.5) / ss) / size, (py + (sy + 0.5) / ss) / size);
          if (!c) continue;
          r += c[0];
          g += c[1];
          b += c[2];
          covered++;
        }
      }
      const i = (py * size + px) * 4;
      if (covered > 0) {
        out[i] = Math.round(r / covered);
        out[i + 1] = Math.round(g / covered);
        out[i + 2] = Math.round(b / covered);
        out[i + 3] = Math.round((255 * covered) / (ss * ss));
      }
    }
  }
  return out;
}

export function encodeIcon(size) {
  const png = new PNG({ width: size, height: size });
  png.data = Buffer.from(renderIcon(size));
  return PNG.sync.write(png);
}

/** Decodes a PNG file into `{ width, height, data }` (RGBA bytes). */
export function decodePng(file) {
  const png = PNG.sync.read(readFileSync(file));
  return { width: png.width, height: png.height, data: new Uint8Array(png.data) };
}

export function iconPath(size, dir = path.dirname(fileURLToPath(import.meta.url))) {
  return path.join(dir, `icon-${size}.png`);
}

function main(argv) {
  const check = argv.includes("--check");
  let stale = 0;
  for (const size of ICON_SIZES) {
    const file = iconPath(size);
    if (check) {
      let same = false;
      try {
        const committed = decodePng(file);
        same = committed.width === size && committed.height === size && Buffer.from(renderIcon(size)).equals(committed.data);
      } catch {
        same = false;
      }
      if (!same) {
        console.error(`${path.relative(process.cwd(), file)} differs from the drawing: run node assets/make-icons.mjs`);
        stale++;
      }
    } else {
      writeFileSync(file, encodeIcon(size));
      console.log(`wrote ${path.relative(process.cwd(), file)} (${size} × ${size})`);
    }
  }
  if (stale > 0) process.exit(1);
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) main(process.argv.slice(2));
