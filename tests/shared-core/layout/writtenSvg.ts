// Test helper: what a written chart SVG draws, read back from its text with the writer's documented structure
// (docs/chart-svg.md): marks as <g class="tg-mark"> of <path data-part data-slot d> or <use> of a <defs> path, texts as
// <g class="tg-text" data-role data-size-pt> holding one outline path (or a <text> when outlines are off).
// Boxes are taken from every coordinate pair of the path data: exact for the glyphs' flattened polygons,
// and for text outlines including the quadratic control points (a box at most a hair larger than the ink).

export interface BoxMm {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface WrittenPiece {
  part: string;
  slot: number | null;
  box: BoxMm;
}

export interface WrittenMark {
  id: string;
  label: string;
  value: number;
  pieces: WrittenPiece[];
  box: BoxMm;
}

export interface WrittenText {
  role: string;
  sizePt: number;
  /** Outline bounds (outlined text) or null for <text>. */
  box: BoxMm | null;
  /** The characters of a <text> element (outlines off), else null. */
  content: string | null;
  /** The outline path data, for comparing two writes. */
  pathData: string | null;
  /** Pen position and anchor of a <text> element (outlines off), else null. */
  pen: { xMm: number; yMm: number; anchor: string } | null;
}

function unescape(s: string): string {
  return s.replace(/&quot;/g, '"').replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&#(\d+);/g, (_, n: string) => String.fromCodePoint(Number(n))).replace(/&amp;/g, '&');
}

function attr(tag: string, name: string): string | null {
  const m = new RegExp(`\\s${name}="([^"]*)"`).exec(tag);
  return m ? unescape(m[1]) : null;
}

export function pathBox(d: string): BoxMm | null {
  const nums = (d.match(/-?\d*\.?\d+(?:e-?\d+)?/gi) ?? []).map(Number);
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i + 1 < nums.length; i += 2) {
    minX = Math.min(minX, nums[i]); maxX = Math.max(maxX, nums[i]);
    minY = Math.min(minY, nums[i + 1]); maxY = Math.max(maxY, nums[i + 1]);
  }
  return Number.isFinite(minX) ? { x: minX, y: minY, width: maxX - minX, height: maxY - minY } : null;
}

export function unionBox(boxes: readonly BoxMm[]): BoxMm {
  const minX = Math.min(...boxes.map((b) => b.x));
  const minY = Math.min(...boxes.map((b) => b.y));
  const maxX = Math.max(...boxes.map((b) => b.x + b.width));
  const maxY = Math.max(...boxes.map((b) => b.y + b.height));
  return { x: minX, y: minY, width: maxX - minX, height: maxY - minY };
}

/** Boxes of the <defs> shapes by id, for pieces placed with <use>. */
function defBoxes(svg: string): Map<string, BoxMm> {
  const out = new Map<string, BoxMm>();
  const defs = /<defs>([\s\S]*?)<\/defs>/.exec(svg)?.[1] ?? '';
  for (const p of defs.matchAll(/<path[^>]*>/g)) {
    const id = attr(p[0], 'id');
    const d = attr(p[0], 'd');
    const box = d ? pathBox(d) : null;
    if (id && box) out.set(id, box);
  }
  return out;
}

/** The marks in file order, full glyphs written out or placed with <use> (SVG 1.1 'use': x and y add a translation). */
export function writtenMarks(svg: string): WrittenMark[] {
  const out: WrittenMark[] = [];
  const shapes = defBoxes(svg);
  const groups = svg.matchAll(/<g id="([^"]+)" class="tg-mark"([^>]*)>([\s\S]*?)<\/g>/g);
  for (const g of groups) {
    const pieces: WrittenPiece[] = [];
    for (const p of g[3].matchAll(/<(?:path|use)\b[^>]*>/g)) {
      let box: BoxMm | null;
      if (p[0].startsWith('<use')) {
        const shape = shapes.get((attr(p[0], 'xlink:href') ?? '').replace(/^#/, ''));
        box = shape ? { ...shape, x: shape.x + Number(attr(p[0], 'x') ?? 0), y: shape.y + Number(attr(p[0], 'y') ?? 0) } : null;
      } else {
        const d = attr(p[0], 'd');
        box = d ? pathBox(d) : null;
      }
      if (!box) continue;
      const slot = attr(p[0], 'data-slot');
      pieces.push({ part: attr(p[0], 'data-part') ?? '', slot: slot === null ? null : Number(slot), box });
    }
    const head = `<g${g[2]}>`;
    out.push({ id: g[1], label: attr(head, 'data-label') ?? '', value: Number(attr(head, 'data-value')), pieces, box: unionBox(pieces.map((p) => p.box)) });
  }
  return out;
}

export function writtenTexts(svg: string): WrittenText[] {
  const out: WrittenText[] = [];
  for (const g of svg.matchAll(/<g class="tg-text"([^>]*)>([\s\S]*?)<\/g>/g)) {
    const head = `<g${g[1]}>`;
    const d = /<path[^>]*\sd="([^"]*)"/.exec(g[2]);
    const t = /<text([^>]*)>([\s\S]*?)<\/text>/.exec(g[2]);
    out.push({
      role: attr(head, 'data-role') ?? '',
      sizePt: Number(attr(head, 'data-size-pt')),
      box: d ? pathBox(d[1]) : null,
      content: t ? unescape(t[2]) : null,
      pathData: d ? d[1] : null,
      pen: t ? { xMm: Number(attr(t[1], 'x')), yMm: Number(attr(t[1], 'y')), anchor: attr(t[1], 'text-anchor') ?? 'start' } : null,
    });
  }
  return out;
}

/** Key glyphs in file order: `<g class="tg-legend-key">` with one filled path (docs/chart-svg.md). */
export function writtenLegendKeys(svg: string): { glyph: string; unitValue: number; box: BoxMm }[] {
  const out: { glyph: string; unitValue: number; box: BoxMm }[] = [];
  for (const g of svg.matchAll(/<g class="tg-legend-key"([^>]*)>([\s\S]*?)<\/g>/g)) {
    const head = `<g${g[1]}>`;
    const d = /<path[^>]*\sd="([^"]*)"/.exec(g[2]);
    const box = d ? pathBox(d[1]) : null;
    if (box) out.push({ glyph: attr(head, 'data-glyph') ?? '', unitValue: Number(attr(head, 'data-unit-value')), box });
  }
  return out;
}

/**
 * Where the chart block may stand, and where it stands: the content box inside the margins between the title's
 * ink and the source line's ink, and the box of all other ink (marks, key glyphs, labels, values, key text).
 * Outlined text only (the default), so every text has an ink box.
 */
export function writtenBlock(svg: string, margins: { left: number; right: number; top: number; bottom: number }, page: { widthMm: number; heightMm: number }): { room: BoxMm; block: BoxMm } {
  const texts = writtenTexts(svg);
  const frame = (role: string) => texts.filter((t) => t.role === role && t.box).map((t) => t.box!);
  const titles = frame('title');
  const sources = frame('source');
  const top = titles.length ? Math.max(...titles.map((b) => b.y + b.height)) : margins.top;
  const bottom = sources.length ? Math.min(...sources.map((b) => b.y)) : page.heightMm - margins.bottom;
  const room = { x: margins.left, y: top, width: page.widthMm - margins.left - margins.right, height: bottom - top };
  const inner = texts.filter((t) => t.role !== 'title' && t.role !== 'source' && t.box).map((t) => t.box!);
  const block = unionBox([...writtenMarks(svg).map((m) => m.box), ...writtenLegendKeys(svg).map((k) => k.box), ...inner]);
  return { room, block };
}
