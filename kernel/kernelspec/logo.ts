/**
 * Sagitta's own kernel logo, drawn from geometry (no image files to carry around): a curved track
 * through five hits, the chord under it, and the sagitta — the arc's height over the chord — in
 * amber. Kernelspec logos are the files `logo-32x32.png`, `logo-64x64.png` and `logo-svg.svg`.
 */
import { encodePng } from './png.js';

const COLORS = Object.freeze({
  ground: [0x14, 0x32, 0x4a] as const,
  track: [0xf2, 0xee, 0xe3] as const,
  sagitta: [0xe8, 0xa3, 0x3d] as const,
});

// Geometry in units of the logo's side. Chord from A to B at y = CHORD_Y, apex at y = APEX_Y.
const A = { x: 0.16, y: 0.7 };
const B = { x: 0.84, y: 0.7 };
const APEX_Y = 0.36;
const HALF = (B.x - A.x) / 2;
const S = A.y - APEX_Y; // the sagitta
const R = (HALF * HALF + S * S) / (2 * S); // s = R − √(R² − L²) solved for R
const C = { x: 0.5, y: APEX_Y + R };
const HIT_ANGLES = [-1, -0.5, 0, 0.5, 1].map((f) => f * Math.asin(HALF / R) * 0.92);
const HITS = HIT_ANGLES.map((a) => ({ x: C.x + R * Math.sin(a), y: C.y - R * Math.cos(a) }));
const WIDTH = Object.freeze({ track: 0.06, chord: 0.03, sagitta: 0.05, hit: 0.05, corner: 0.2 });

function segmentDistance(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const t = Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(px - (ax + t * dx), py - (ay + t * dy));
}

/** Colour and opacity of the logo at a point (u, v) in [0,1]², before anti-aliasing. */
function shade(u: number, v: number): [number, number, number, number] {
  // Rounded square.
  const k = WIDTH.corner;
  const qx = Math.max(Math.abs(u - 0.5) - (0.5 - k), 0);
  const qy = Math.max(Math.abs(v - 0.5) - (0.5 - k), 0);
  if (Math.hypot(qx, qy) > k) return [0, 0, 0, 0];
  if (HITS.some((h) => Math.hypot(u - h.x, v - h.y) < WIDTH.hit)) return [...COLORS.sagitta, 255];
  if (Math.abs(u - 0.5) < WIDTH.sagitta / 2 && v > APEX_Y && v < A.y) return [...COLORS.sagitta, 255];
  const onArc = Math.abs(Math.hypot(u - C.x, v - C.y) - R) < WIDTH.track / 2 && v < A.y + 0.02;
  if (onArc) return [...COLORS.track, 255];
  if (segmentDistance(u, v, A.x, A.y, B.x, B.y) < WIDTH.chord / 2) {
    const mix = 0.55;
    const c = COLORS.ground.map((g, i) => Math.round(g + mix * (COLORS.track[i] - g)));
    return [c[0], c[1], c[2], 255];
  }
  return [...COLORS.ground, 255];
}

/** The logo as a `size`×`size` PNG (4×4 supersampled). */
export function logoPng(size: number): Buffer {
  const rgba = new Uint8Array(size * size * 4);
  const n = 4;
  for (let y = 0; y < size; y++) {
    for (let x = 0; x < size; x++) {
      let r = 0, g = 0, b = 0, a = 0;
      for (let j = 0; j < n; j++) {
        for (let i = 0; i < n; i++) {
          const [cr, cg, cb, ca] = shade((x + (i + 0.5) / n) / size, (y + (j + 0.5) / n) / size);
          r += cr * ca; g += cg * ca; b += cb * ca; a += ca;
        }
      }
      const o = (y * size + x) * 4;
      rgba[o] = a > 0 ? Math.round(r / a) : 0;
      rgba[o + 1] = a > 0 ? Math.round(g / a) : 0;
      rgba[o + 2] = a > 0 ? Math.round(b / a) : 0;
      rgba[o + 3] = Math.round(a / (n * n));
    }
  }
  return encodePng(size, size, rgba);
}

/** The same logo as SVG (100×100 user units). */
export function logoSvg(): string {
  const f = (v: number) => (v * 100).toFixed(2);
  const hex = (c: readonly number[]) => `#${c.map((x) => x.toString(16).padStart(2, '0')).join('')}`;
  const theta = Math.asin(HALF / R);
  const arcStart = { x: C.x - R * Math.sin(theta), y: C.y - R * Math.cos(theta) };
  const arcEnd = { x: C.x + R * Math.sin(theta), y: C.y - R * Math.cos(theta) };
  return [
    '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100" width="100" height="100">',
    '<title>Sagitta</title>',
    `<rect x="0" y="0" width="100" height="100" rx="${f(WIDTH.corner)}" fill="${hex(COLORS.ground)}"/>`,
    `<line x1="${f(A.x)}" y1="${f(A.y)}" x2="${f(B.x)}" y2="${f(B.y)}" stroke="${hex(COLORS.track)}" stroke-opacity="0.55" stroke-width="${f(WIDTH.chord)}"/>`,
    `<path d="M ${f(arcStart.x)} ${f(arcStart.y)} A ${f(R)} ${f(R)} 0 0 1 ${f(arcEnd.x)} ${f(arcEnd.y)}" fill="none" stroke="${hex(COLORS.track)}" stroke-width="${f(WIDTH.track)}"/>`,
    `<line x1="50" y1="${f(APEX_Y)}" x2="50" y2="${f(A.y)}" stroke="${hex(COLORS.sagitta)}" stroke-width="${f(WIDTH.sagitta)}"/>`,
    ...HITS.map((h) => `<circle cx="${f(h.x)}" cy="${f(h.y)}" r="${f(WIDTH.hit)}" fill="${hex(COLORS.sagitta)}"/>`),
    '</svg>',
  ].join('\n');
}
