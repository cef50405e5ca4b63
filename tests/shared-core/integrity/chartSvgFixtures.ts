// Chart SVGs written by hand in the tests, following docs/chart-svg.md to the letter, so the verifier can be
// checked without the project's layout or writer. Geometry is plain polygons whose areas have closed forms.

export type Reading = 'count' | 'length' | 'area' | 'fill';
export type Part = 'full' | 'partial' | 'filled' | 'rest';

export interface Point {
  x: number;
  y: number;
}

export interface HandPiece {
  ring: Point[];
  part: Part;
  slot?: number;
  fill?: string;
}

export interface HandMark {
  id: string;
  label: string;
  value: number;
  pieces: HandPiece[];
}

export interface HandChart {
  widthMm?: number;
  heightMm?: number;
  bleedMm?: number;
  reading: Reading;
  mode: 'repeat' | 'stack' | 'scale' | 'fill';
  unit: number;
  unitName?: string;
  marks: HandMark[];
  legend?: { ring: Point[]; glyph: string; unitValue: number };
  /** Extra markup placed after the marks (text, rules, backgrounds). */
  extra?: string;
  /** Extra markup placed first (a background). */
  under?: string;
  baselineY?: number;
  /** Overrides for the summary JSON. */
  summary?: Record<string, unknown>;
  /** Put glyphs in <defs> and draw full pieces with <use>. */
  useRefs?: boolean;
}

const DTD_SUBSET = [
  '<!ATTLIST g data-label CDATA #IMPLIED data-value CDATA #IMPLIED data-reading CDATA #IMPLIED data-glyph CDATA #IMPLIED data-unit-value CDATA #IMPLIED data-role CDATA #IMPLIED data-baseline-y CDATA #IMPLIED data-size-pt CDATA #IMPLIED>',
  '<!ATTLIST path data-part CDATA #IMPLIED data-slot CDATA #IMPLIED>',
  '<!ATTLIST use data-part CDATA #IMPLIED data-slot CDATA #IMPLIED>',
].join(' ');

const f = (n: number) => String(Number(n.toFixed(6)));
export const ringPath = (ring: Point[]) => 'M' + ring.map((p) => `${f(p.x)} ${f(p.y)}`).join('L') + 'Z';
const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

export const rect = (x: number, y: number, w: number, h: number): Point[] => [
  { x, y },
  { x: x + w, y },
  { x: x + w, y: y + h },
  { x, y: y + h },
];

/** Regular polygon inscribed in a circle of radius r: area (n/2) r² sin(2π/n). */
export function polygon(cx: number, cy: number, r: number, n = 256): Point[] {
  return Array.from({ length: n }, (_, i) => ({ x: cx + r * Math.cos((2 * Math.PI * i) / n), y: cy + r * Math.sin((2 * Math.PI * i) / n) }));
}
export const polygonArea = (r: number, n = 256) => (n / 2) * r * r * Math.sin((2 * Math.PI) / n);

/** Isosceles triangle, apex up, base width w on y = baseY. */
export function triangleUp(x: number, baseY: number, w: number, h: number): Point[] {
  return [
    { x, y: baseY },
    { x: x + w, y: baseY },
    { x: x + w / 2, y: baseY - h },
  ];
}

/**
 * The part of the upward triangle below height t·h (a trapezoid). Its share of the triangle's ink is
 * 1 − (1 − t)² (similar triangles: the part above the cut is a triangle scaled by 1 − t).
 */
export function triangleUpBelow(x: number, baseY: number, w: number, h: number, t: number): Point[] {
  const half = (w / 2) * (1 - t);
  return [
    { x, y: baseY },
    { x: x + w, y: baseY },
    { x: x + w / 2 + half, y: baseY - t * h },
    { x: x + w / 2 - half, y: baseY - t * h },
  ];
}
export function triangleUpAbove(x: number, baseY: number, w: number, h: number, t: number): Point[] {
  const half = (w / 2) * (1 - t);
  return [
    { x: x + w / 2 + half, y: baseY - t * h },
    { x: x + w / 2, y: baseY - h },
    { x: x + w / 2 - half, y: baseY - t * h },
  ];
}
/** Cut height for an ink share f of the upward triangle: 1 − (1 − t)² = f. */
export const triangleCutForShare = (share: number) => 1 - Math.sqrt(1 - share);

/** Triangle pointing right: left edge x..., width w. Ink left of x + t·w is (2t − t²) of the whole. */
export function triangleRight(x: number, y: number, w: number, h: number): Point[] {
  return [
    { x, y },
    { x: x + w, y: y + h / 2 },
    { x, y: y + h },
  ];
}
export function triangleRightLeftPart(x: number, y: number, w: number, h: number, t: number): Point[] {
  const half = (h / 2) * (1 - t);
  return [
    { x, y },
    { x: x + t * w, y: y + h / 2 - half },
    { x: x + t * w, y: y + h / 2 + half },
    { x, y: y + h },
  ];
}
/** Width fraction for an ink share f of the right-pointing triangle: 2t − t² = f. */
export const triangleRightCutForShare = (share: number) => 1 - Math.sqrt(1 - share);

export function ringArea(ring: Point[]): number {
  let s = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) s += (ring[j].x + ring[i].x) * (ring[j].y - ring[i].y);
  return Math.abs(s / 2);
}

export function chartSvg(c: HandChart): string {
  const W = c.widthMm ?? 200;
  const H = c.heightMm ?? 150;
  const b = c.bleedMm ?? 0;
  const summary = {
    format: 'tallyglyph.summary/1',
    title: 'Hand-written test chart',
    source: 'invented test data',
    mode: c.mode,
    reading: c.reading,
    unit: c.unit,
    unitName: c.unitName ?? 'things',
    data: c.marks.map((m) => ({ id: m.id, label: m.label, value: m.value })),
    ...c.summary,
  };
  const defs: string[] = [];
  const marks = c.marks
    .map((m) => {
      const pieces = m.pieces
        .map((p, i) => {
          const slot = p.slot !== undefined ? ` data-slot="${p.slot}"` : '';
          const fill = p.fill ?? (p.part === 'rest' ? '#dddddd' : '#1f77b4');
          if (c.useRefs && p.part === 'full') {
            // Glyph geometry relative to its first point, placed with x/y on the <use>.
            const o = p.ring[0];
            const id = `glyph-${m.id}-${i}`;
            defs.push(`<path id="${id}" d="${ringPath(p.ring.map((q) => ({ x: q.x - o.x, y: q.y - o.y })))}"/>`);
            return `<use xlink:href="#${id}" x="${f(o.x)}" y="${f(o.y)}" fill="${fill}" data-part="full"${slot}/>`;
          }
          return `<path d="${ringPath(p.ring)}" fill="${fill}" data-part="${p.part}"${slot}/>`;
        })
        .join('');
      return `<g id="${m.id}" class="tg-mark" data-label="${esc(m.label)}" data-value="${m.value}" data-reading="${c.reading}">${pieces}</g>`;
    })
    .join('');
  const legend = c.legend
    ? `<g class="tg-legend-key" data-glyph="${c.legend.glyph}" data-unit-value="${c.legend.unitValue}"><path d="${ringPath(c.legend.ring)}" fill="#1f77b4"/></g>`
    : '';
  const baseline = c.baselineY !== undefined ? ` data-baseline-y="${c.baselineY}"` : '';
  return (
    '<?xml version="1.0" encoding="UTF-8" standalone="no"?>\n' +
    `<!DOCTYPE svg PUBLIC "-//W3C//DTD SVG 1.1//EN" "http://www.w3.org/Graphics/SVG/1.1/DTD/svg11.dtd" [ ${DTD_SUBSET} ]>\n` +
    `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" version="1.1" width="${f(W + 2 * b)}mm" height="${f(H + 2 * b)}mm" viewBox="${f(-b)} ${f(-b)} ${f(W + 2 * b)} ${f(H + 2 * b)}">` +
    `<metadata id="tallyglyph-summary">${esc(JSON.stringify(summary))}</metadata>` +
    (defs.length ? `<defs>${defs.join('')}</defs>` : '') +
    (c.under ?? '') +
    `<g class="tg-marks"${baseline}>${marks}</g>` +
    legend +
    (c.extra ?? '') +
    '</svg>\n'
  );
}

// ---- charts per mode

/** Repeat: one row of square glyphs per category; the remainder is an ink-true cut (for a square, its width). */
export function repeatChart(values: { label: string; value: number }[], opts: { unit?: number; sizeMm?: number; scaleOf?: (i: number) => number; useRefs?: boolean; legend?: boolean } = {}): string {
  const unit = opts.unit ?? 10;
  const s = opts.sizeMm ?? 8;
  const pitch = s * 1.25;
  const marks: HandMark[] = values.map((v, row) => {
    const k = opts.scaleOf ? opts.scaleOf(row) : 1;
    const g = s * k;
    const y = 20 + row * pitch * 1.6;
    const n = v.value / unit;
    const whole = Math.floor(n + 1e-12);
    const pieces: HandPiece[] = [];
    for (let i = 0; i < whole; i++) pieces.push({ ring: rect(20 + i * pitch, y, g, g), part: 'full' });
    const frac = n - whole;
    if (frac > 1e-9) pieces.push({ ring: rect(20 + whole * pitch, y, g * frac, g), part: 'partial' });
    return { id: `mark-${row + 1}`, label: v.label, value: v.value, pieces };
  });
  const longest = Math.max(...values.map((v) => Math.ceil(v.value / unit)));
  return chartSvg({
    reading: 'count',
    mode: 'repeat',
    unit,
    marks,
    widthMm: Math.max(200, 40 + longest * pitch),
    useRefs: opts.useRefs,
    legend: opts.legend === false ? undefined : { ring: rect(20, 130, s, s), glyph: 'square', unitValue: unit },
  });
}

/** Repeat with a right-pointing triangle, remainder cut at an ink share (honest) or at a width share (dishonest). */
export function triangleRepeatChart(values: { label: string; value: number }[], cutBy: 'ink' | 'width', unit = 1): string {
  const s = 10;
  const pitch = 12;
  const marks: HandMark[] = values.map((v, row) => {
    const y = 20 + row * 20;
    const n = v.value / unit;
    const whole = Math.floor(n + 1e-12);
    const pieces: HandPiece[] = [];
    for (let i = 0; i < whole; i++) pieces.push({ ring: triangleRight(20 + i * pitch, y, s, s), part: 'full' });
    const frac = n - whole;
    if (frac > 1e-9) {
      const t = cutBy === 'ink' ? triangleRightCutForShare(frac) : frac;
      pieces.push({ ring: triangleRightLeftPart(20 + whole * pitch, y, s, s, t), part: 'partial' });
    }
    return { id: `mark-${row + 1}`, label: v.label, value: v.value, pieces };
  });
  return chartSvg({ reading: 'count', mode: 'repeat', unit, marks, legend: { ring: triangleRight(20, 130, s, s), glyph: 'triangle', unitValue: unit } });
}

/** Stack: square glyphs upward from one baseline, one pitch per glyph; remainder is the bottom part of a glyph. */
export function stackChart(
  values: { label: string; value: number }[],
  opts: { unit?: number; sizeMm?: number; gapOf?: (i: number) => number; liftOf?: (i: number) => number } = {},
): string {
  const unit = opts.unit ?? 10;
  const s = opts.sizeMm ?? 6;
  const baseY = 130;
  const marks: HandMark[] = values.map((v, col) => {
    const pitch = s * (1 + (opts.gapOf ? opts.gapOf(col) : 0.25));
    const lift = opts.liftOf ? opts.liftOf(col) : 0;
    const x = 20 + col * 15;
    const n = v.value / unit;
    const whole = Math.floor(n + 1e-12);
    const pieces: HandPiece[] = [];
    for (let k = 0; k < whole; k++) pieces.push({ ring: rect(x, baseY - lift - k * pitch - s, s, s), part: 'full', slot: k });
    const frac = n - whole;
    if (frac > 1e-9) pieces.push({ ring: rect(x, baseY - lift - whole * pitch - s * frac, s, s * frac), part: 'partial', slot: whole });
    return { id: `mark-${col + 1}`, label: v.label, value: v.value, pieces };
  });
  return chartSvg({
    reading: 'length',
    mode: 'stack',
    unit,
    marks,
    baselineY: baseY,
    heightMm: 150,
    summary: { pitchMm: s * 1.25, baselineYMm: baseY },
    legend: { ring: rect(170, 20, s, s), glyph: 'square', unitValue: unit },
  });
}

/**
 * Scale: one circle-like polygon per category. Honest: area proportional to the value (radius ∝ √v).
 * Dishonest 'height': the glyph's height (and so, keeping its shape, its width) proportional to the value,
 * so its area grows with the square of the value.
 */
export function scaleChart(values: { label: string; value: number }[], scaleBy: 'area' | 'height', mm2PerValue = 2): string {
  const max = Math.max(...values.map((v) => v.value));
  const rMax = Math.sqrt((mm2PerValue * max) / polygonArea(1));
  const marks: HandMark[] = values.map((v, i) => {
    const r = scaleBy === 'area' ? Math.sqrt((mm2PerValue * v.value) / polygonArea(1)) : (rMax * v.value) / max;
    const cx = 30 + i * (2 * rMax + 5);
    return { id: `mark-${i + 1}`, label: v.label, value: v.value, pieces: r > 0 ? [{ ring: polygon(cx, 75, r), part: 'full' as Part }] : [] };
  });
  return chartSvg({ reading: 'area', mode: 'scale', unit: 1 / mm2PerValue, marks, widthMm: 40 + values.length * (2 * rMax + 5) });
}

/** Fill: an upward triangle per category filled from its base to an ink share (honest) or a height share (dishonest). */
export function fillChart(values: { label: string; value: number }[], fillBy: 'ink' | 'height', full?: number): string {
  const max = full ?? Math.max(...values.map((v) => v.value));
  const w = 20;
  const h = 24;
  const baseY = 100;
  const marks: HandMark[] = values.map((v, i) => {
    const share = v.value / max;
    const t = fillBy === 'ink' ? triangleCutForShare(share) : share;
    const x = 20 + i * 30;
    const pieces: HandPiece[] = [];
    if (t >= 1) pieces.push({ ring: triangleUp(x, baseY, w, h), part: 'filled' });
    else if (t <= 0) pieces.push({ ring: triangleUp(x, baseY, w, h), part: 'rest' });
    else {
      pieces.push({ ring: triangleUpBelow(x, baseY, w, h, t), part: 'filled' });
      pieces.push({ ring: triangleUpAbove(x, baseY, w, h, t), part: 'rest' });
    }
    return { id: `mark-${i + 1}`, label: v.label, value: v.value, pieces };
  });
  return chartSvg({ reading: 'fill', mode: 'fill', unit: max, marks });
}
