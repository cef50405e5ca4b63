// Pure, so the app finds marks in a dropped image exactly as the `audit` command does.
// Marks in a raster mock-up: connected regions of colour that differs from the background by more
// than a tolerance (or the regions under seed points the user gives), measured in pixels.
// Ink area sums coverage: inner pixels count whole, anti-aliased edge pixels by how far their colour
// lies from the background towards the fill beside them, so soft edges neither add nor lose area.
import { TallyError } from '../errors';
import { mergeTouching, unionBox } from './mergeTouching';
import type { MarkPart, MeasuredMark, SetAside } from './types';
import type { Box } from '../geometry/region';
import type { RasterImage } from './rasterHeaders';

export interface Rgb {
  r: number;
  g: number;
  b: number;
}

export interface RasterMarkOptions {
  /** Largest per-channel difference (0–255) from the background still read as background; default 24. */
  tolerance?: number;
  /** Background colour; default: the most common colour along the image border. */
  background?: Rgb;
  /** Points (in pixels) inside the marks, in value order; when given, only these regions are marks. */
  seeds?: ReadonlyArray<{ xPx: number; yPx: number }>;
  /** Regions with less coverage than this share of the largest are set aside as text or noise; default 0.002. */
  minAreaFraction?: number;
  /** Pieces this close (px) belong to one picture; default max(2, 0.5% of the image diagonal). */
  mergeGapPx?: number;
}

export interface RasterMarks {
  marks: MeasuredMark[];
  background: Rgb;
  setAside: SetAside[];
}

interface Component {
  label: number;
  box: Box;
  coverage: number;
  pixels: number;
  colours: Map<number, number>;
}

/** Composite straight RGBA over white, as a viewer shows a transparent mock-up. */
function flatten(img: RasterImage): Uint8Array {
  const n = img.widthPx * img.heightPx;
  const rgb = new Uint8Array(n * 3);
  const src = img.rgba;
  for (let i = 0, j = 0; i < n * 4; i += 4, j += 3) {
    const a = src[i + 3];
    rgb[j] = (src[i] * a + 255 * (255 - a) + 127) / 255;
    rgb[j + 1] = (src[i + 1] * a + 255 * (255 - a) + 127) / 255;
    rgb[j + 2] = (src[i + 2] * a + 255 * (255 - a) + 127) / 255;
  }
  return rgb;
}

function borderBackground(rgb: Uint8Array, w: number, h: number): Rgb {
  const counts = new Map<number, number>();
  const add = (x: number, y: number) => {
    const j = (y * w + x) * 3;
    const key = (rgb[j] << 16) | (rgb[j + 1] << 8) | rgb[j + 2];
    counts.set(key, (counts.get(key) ?? 0) + 1);
  };
  for (let x = 0; x < w; x++) {
    add(x, 0);
    add(x, h - 1);
  }
  for (let y = 0; y < h; y++) {
    add(0, y);
    add(w - 1, y);
  }
  let best = 0xffffff, n = -1;
  for (const [k, c] of counts) if (c > n) [best, n] = [k, c];
  return { r: best >> 16, g: (best >> 8) & 255, b: best & 255 };
}

export function findRasterMarks(img: RasterImage, opts: RasterMarkOptions = {}): RasterMarks {
  const w = img.widthPx, h = img.heightPx;
  const tolerance = opts.tolerance ?? 24;
  if (!(tolerance >= 0 && tolerance < 255)) throw new TallyError('usage', `The colour tolerance must be between 0 and 254 (got ${tolerance}).`);
  const rgb = flatten(img);
  const bg = opts.background ?? borderBackground(rgb, w, h);
  const n = w * h;
  const ink = new Uint8Array(n);
  for (let p = 0, j = 0; p < n; p++, j += 3) {
    const d = Math.max(Math.abs(rgb[j] - bg.r), Math.abs(rgb[j + 1] - bg.g), Math.abs(rgb[j + 2] - bg.b));
    if (d > tolerance) ink[p] = 1;
  }

  const setAside: SetAside[] = [];
  if (!opts.seeds || !opts.seeds.length) setAside.push(...removeRules(ink, w, h));

  // Connected regions, 8-connected, labelled with an explicit stack (no recursion on big regions).
  const labels = new Int32Array(n);
  const comps: Component[] = [];
  const stack = new Int32Array(n);
  for (let start = 0; start < n; start++) {
    if (!ink[start] || labels[start]) continue;
    const label = comps.length + 1;
    let top = 0;
    stack[top++] = start;
    labels[start] = label;
    let minX = w, minY = h, maxX = -1, maxY = -1, pixels = 0;
    while (top) {
      const p = stack[--top];
      const x = p % w, y = (p - x) / w;
      pixels++;
      if (x < minX) minX = x;
      if (x > maxX) maxX = x;
      if (y < minY) minY = y;
      if (y > maxY) maxY = y;
      for (let dy = -1; dy <= 1; dy++) {
        const yy = y + dy;
        if (yy < 0 || yy >= h) continue;
        for (let dx = -1; dx <= 1; dx++) {
          const xx = x + dx;
          if (xx < 0 || xx >= w || (dx === 0 && dy === 0)) continue;
          const q = yy * w + xx;
          if (ink[q] && !labels[q]) {
            labels[q] = label;
            stack[top++] = q;
          }
        }
      }
    }
    comps.push({ label, box: { x: minX, y: minY, width: maxX - minX + 1, height: maxY - minY + 1 }, coverage: 0, pixels, colours: new Map() });
    if (comps.length > 100_000) throw new TallyError('raster-invalid', 'The image breaks into more than 100,000 separate regions (region limit); it looks like a photo or noise rather than a chart.');
  }
  if (!comps.length) throw new TallyError('glyph-empty', 'Nothing in the image differs from the background colour; there are no marks to measure.');

  // Coverage: inner pixels count 1; an edge pixel counts by its colour's share of the way from the
  // background to the most inked neighbour of the same region (anti-aliasing mixes the two).
  for (let p = 0, j = 0; p < n; p++, j += 3) {
    const label = labels[p];
    if (!label) continue;
    const c = comps[label - 1];
    const x = p % w, y = (p - x) / w;
    const key = (rgb[j] << 16) | (rgb[j + 1] << 8) | rgb[j + 2];
    let edge = false;
    let best = -1, bestD = -1;
    for (let dy = -1; dy <= 1; dy++) {
      for (let dx = -1; dx <= 1; dx++) {
        if (dx === 0 && dy === 0) continue;
        const xx = x + dx, yy = y + dy;
        if (xx < 0 || xx >= w || yy < 0 || yy >= h) {
          continue;
        }
        const q = yy * w + xx;
        if (labels[q] !== label) {
          edge = true;
          continue;
        }
        const k = q * 3;
        const d = Math.max(Math.abs(rgb[k] - bg.r), Math.abs(rgb[k + 1] - bg.g), Math.abs(rgb[k + 2] - bg.b));
        if (d > bestD) [best, bestD] = [q, d];
      }
    }
    if (!edge) {
      c.coverage += 1;
      c.colours.set(key, (c.colours.get(key) ?? 0) + 1);
      continue;
    }
    const ownD = Math.max(Math.abs(rgb[j] - bg.r), Math.abs(rgb[j + 1] - bg.g), Math.abs(rgb[j + 2] - bg.b));
    if (best < 0 || bestD <= ownD) {
      c.coverage += 1;
      continue;
    }
    const k = best * 3;
    const fr = rgb[k] - bg.r, fg = rgb[k + 1] - bg.g, fb = rgb[k + 2] - bg.b;
    const dot = (rgb[j] - bg.r) * fr + (rgb[j + 1] - bg.g) * fg + (rgb[j + 2] - bg.b) * fb;
    const norm = fr * fr + fg * fg + fb * fb;
    c.coverage += norm > 0 ? Math.max(0, Math.min(1, dot / norm)) : 1;
  }

  const diagonal = Math.hypot(w, h);
  const gap = opts.mergeGapPx ?? Math.max(2, Math.round(0.005 * diagonal));
  let groups: Component[][];
  if (opts.seeds && opts.seeds.length) {
    groups = opts.seeds.map((s, i) => {
      const x = Math.round(s.xPx), y = Math.round(s.yPx);
      if (!(x >= 0 && x < w && y >= 0 && y < h)) throw new TallyError('usage', `Seed point ${i + 1} (${s.xPx}, ${s.yPx}) lies outside the ${w} x ${h} image.`);
      let label = labels[y * w + x];
      // A seed dropped on an anti-aliased edge or a thin gap: look a few pixels around it.
      for (let r = 1; !label && r <= 3; r++) {
        for (let dy = -r; dy <= r && !label; dy++) for (let dx = -r; dx <= r && !label; dx++) {
          const xx = x + dx, yy = y + dy;
          if (xx >= 0 && xx < w && yy >= 0 && yy < h) label = labels[yy * w + xx];
        }
      }
      if (!label) throw new TallyError('usage', `Seed point ${i + 1} (${s.xPx}, ${s.yPx}) lands on the background, not on a mark.`);
      return [comps[label - 1]];
    });
    const seen = new Set<number>();
    groups.forEach((g, i) => {
      if (seen.has(g[0].label)) throw new TallyError('usage', `Seed point ${i + 1} lands in the same region as an earlier seed point.`);
      seen.add(g[0].label);
    });
  } else {
    const largest = Math.max(...comps.map((c) => c.coverage));
    const merged = mergeTouching(comps.map((c) => c.box), gap);
    for (const i of merged.connectors) setAside.push({ kind: 'connector', description: `A region at (${comps[i].box.x}, ${comps[i].box.y}) px touches and spans several separate marks: read as an axis, frame or background, not a mark.` });
    groups = merged.groups.map((g) => g.map((i) => comps[i]));
    const min = (opts.minAreaFraction ?? 0.002) * largest;
    const small = groups.filter((g) => g.reduce((s, c) => s + c.coverage, 0) < min);
    if (small.length) setAside.push({ kind: 'small', description: `${small.length} small region(s) (under ${((opts.minAreaFraction ?? 0.002) * 100).toFixed(1)}% of the largest mark) were read as text or noise, not marks; give seed points to measure them.` });
    groups = groups.filter((g) => !small.includes(g));
    groups.sort((a, b) => {
      const ba = unionBox(a.map((c) => c.box)), bb = unionBox(b.map((c) => c.box));
      return ba.x - bb.x || ba.y - bb.y;
    });
  }

  const marks: MeasuredMark[] = groups.map((g, i) => {
    const parts: MarkPart[] = g.map((c) => ({ box: c.box, inkAreaUnits2: c.coverage }));
    const colours = new Map<number, number>();
    for (const c of g) for (const [k, v] of c.colours) colours.set(k, (colours.get(k) ?? 0) + v);
    const top = [...colours.entries()].sort((a, b) => b[1] - a[1]).slice(0, 4).map(([k]) => `#${k.toString(16).padStart(6, '0')}`);
    return {
      id: `mark-${i + 1}`,
      label: `mark-${i + 1}`,
      box: unionBox(g.map((c) => c.box)),
      inkAreaUnits2: parts.reduce((s, p) => s + p.inkAreaUnits2, 0),
      parts,
      solidCues: [],
      colours: top,
    };
  });
  return { marks, background: bg, setAside };
}

/**
 * Clears axis lines and baselines: bands at most max(3 px, 1% of the image) thick in which more
 * than half of every row (or column) is ink. Bars standing on a baseline would otherwise join into
 * one region. Common practice, no source.
 */
function removeRules(ink: Uint8Array, w: number, h: number): SetAside[] {
  const out: SetAside[] = [];
  const clear = (lines: number, length: number, at: (line: number, k: number) => number, what: string) => {
    const full = new Uint8Array(lines);
    for (let a = 0; a < lines; a++) {
      let n = 0;
      for (let k = 0; k < length; k++) n += ink[at(a, k)];
      full[a] = n > length / 2 ? 1 : 0;
    }
    const thin = Math.max(3, Math.round(lines * 0.01));
    for (let a = 0; a < lines; ) {
      if (!full[a]) {
        a++;
        continue;
      }
      let b = a;
      while (b < lines && full[b]) b++;
      if (b - a <= thin) {
        for (let line = a; line < b; line++) for (let k = 0; k < length; k++) ink[at(line, k)] = 0;
        out.push({ kind: 'connector', description: `A ${what} line ${b - a} px thick at ${a} px (an axis or baseline) was not counted as a mark.` });
      }
      a = b;
    }
  };
  clear(h, w, (y, x) => y * w + x, 'horizontal');
  clear(w, h, (x, y) => y * w + x, 'vertical');
  return out;
}
