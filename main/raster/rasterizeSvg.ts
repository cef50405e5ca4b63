// SVG to PNG at a physical resolution: the page size in mm decides the pixel size, and the PNG says its ppi.

import { Resvg } from '@resvg/resvg-js';
import { SaxesParser, type SaxesTagNS } from 'saxes';
import { TallyError } from '../../shared-core/errors';
import { constants as zlibConstants, deflateRawSync } from 'node:zlib';
import { pngCrc32, withPhysChunk } from './physChunk';

const SVG_NS = 'http://www.w3.org/2000/svg';
const MM_PER_INCH = 25.4;
/** CSS absolute units (CSS Values and Units): 1in = 25.4mm = 96px = 72pt = 6pc. */
const MM_PER_UNIT: Record<string, number> = {
  mm: 1,
  cm: 10,
  in: MM_PER_INCH,
  pt: MM_PER_INCH / 72,
  pc: MM_PER_INCH / 6,
  px: MM_PER_INCH / 96,
  '': MM_PER_INCH / 96,
};
const MM_PER_CSS_PX = MM_PER_INCH / 96;

/**
 * Bounds on the raster. 20000 px a side; 250 Mpx is a 1 GB RGBA buffer (A0 at 300 ppi is 139 Mpx),
 * which resvg copies once more when the pixels are read. Both are common-practice limits, no source.
 */
export const RASTER_LIMITS = { maxSidePx: 20_000, maxPixels: 250_000_000 } as const;

export interface SvgPageSize {
  widthMm: number;
  heightMm: number;
  /** The same size in CSS px (96 per inch), the unit resvg works in. */
  widthCssPx: number;
  heightCssPx: number;
}

export interface RasterOptions {
  /** Pixels per inch; default 300. */
  ppi?: number;
  /** CSS colour painted under the drawing; default transparent. */
  background?: string;
  /** Also return the premultiplied RGBA pixels (costs one copy of the raster). */
  keepPixels?: boolean;
  maxSidePx?: number;
  maxPixels?: number;
  /**
   * resvg reads images named by a file path (even absolute ones) from disk. By default any href that is not
   * `#fragment` or an embedded PNG/JPEG/GIF/WebP data URL is refused, so a supplied SVG cannot pull in local files.
   */
  allowExternalFiles?: boolean;
}

export interface RasterPixels {
  widthPx: number;
  heightPx: number;
  /** Premultiplied RGBA, row by row, as resvg renders it. */
  pixels: Uint8Array;
  page: SvgPageSize;
  /** Page millimetres per pixel (resvg scales x and y alike, by widthPx / page width). */
  mmPerPx: number;
}

export interface RasterResult {
  /** PNG file bytes with a pHYs chunk giving the resolution. */
  png: Buffer;
  widthPx: number;
  heightPx: number;
  ppi: number;
  mmPerPx: number;
  pixels?: Uint8Array;
}

interface Length {
  value: number;
  unit: string;
}

// Same grammar as resvg accepts (no surrounding spaces, lower-case units); anything else is refused rather than
// guessed, because resvg would silently fall back to 100 px.
const LENGTH_RE = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)(mm|cm|in|pt|pc|px|%)?$/;

function parseLength(name: string, text: string | undefined): Length | null {
  if (text === undefined) return null;
  const m = LENGTH_RE.exec(text);
  if (!m) {
    throw new TallyError('raster-invalid', `The SVG's ${name} "${text}" is not a length this program can read; use a number with mm, cm, in, pt, pc or px.`);
  }
  return { value: Number(m[1]), unit: m[2] ?? '' };
}

function parseViewBox(text: string | undefined): { width: number; height: number } | null {
  if (text === undefined) return null;
  const parts = text.trim().split(/[\s,]+/).map(Number);
  if (parts.length !== 4 || parts.some((n) => !Number.isFinite(n)) || parts[2] <= 0 || parts[3] <= 0) {
    throw new TallyError('raster-invalid', `The SVG's viewBox "${text}" is not four numbers with a positive width and height.`);
  }
  return { width: parts[2], height: parts[3] };
}

const ALLOWED_DATA_URL = /^data:image\/(png|jpeg|jpg|gif|webp)[;,]/i;

interface RootScan {
  attributes: Record<string, string>;
}

/** One pass over the document: checks it is well-formed SVG, reads the root's attributes, vets every href. */
function scanSvg(svg: string, allowExternalFiles: boolean): RootScan {
  const parser = new SaxesParser({ xmlns: true, position: false });
  let root: SaxesTagNS | null = null;
  parser.on('opentag', (tag) => {
    if (!root) root = tag;
    // A hyperlink (<a href>) loads nothing when rendering; every other href may.
    if (allowExternalFiles || tag.local === 'a') return;
    for (const attr of Object.values(tag.attributes)) {
      if (attr.local !== 'href') continue;
      const href = attr.value.trim();
      if (href.startsWith('#') || ALLOWED_DATA_URL.test(href)) continue;
      const shown = href.length > 60 ? `${href.slice(0, 57)}...` : href;
      throw new TallyError('raster-invalid', `The SVG refers to an outside file ("${shown}"); embed the image or remove it before rendering.`);
    }
  });
  try {
    parser.write(svg).close();
  } catch (e) {
    if (e instanceof TallyError) throw e;
    throw new TallyError('svg-malformed', `The SVG is not well-formed XML: ${(e as Error).message}`);
  }
  const top = root as SaxesTagNS | null;
  if (!top || top.local !== 'svg' || top.uri !== SVG_NS) {
    throw new TallyError('svg-malformed', 'The file is not an SVG document: its root element is not <svg> in the SVG namespace.');
  }
  const attributes: Record<string, string> = {};
  for (const attr of Object.values(top.attributes)) if (attr.uri === '') attributes[attr.local] = attr.value;
  return { attributes };
}

function pageSizeFromAttributes(attributes: Record<string, string>): SvgPageSize {
  const width = parseLength('width', attributes.width);
  const height = parseLength('height', attributes.height);
  const viewBox = parseViewBox(attributes.viewBox);
  const relative = (l: Length | null) => l === null || l.unit === '%';
  let widthMm: number;
  let heightMm: number;
  if (width && height && !relative(width) && !relative(height)) {
    widthMm = width.value * MM_PER_UNIT[width.unit];
    heightMm = height.value * MM_PER_UNIT[height.unit];
  } else if (relative(width) && relative(height) && viewBox) {
    // Missing or percentage sizes fall back to the viewBox in px, as resvg does.
    widthMm = viewBox.width * ((width?.value ?? 100) / 100) * MM_PER_CSS_PX;
    heightMm = viewBox.height * ((height?.value ?? 100) / 100) * MM_PER_CSS_PX;
  } else if (relative(width) !== relative(height)) {
    throw new TallyError('raster-invalid', 'The SVG gives only one of width and height as a fixed length; give both (for example in mm).');
  } else {
    throw new TallyError('raster-invalid', 'The SVG has no fixed size: give the root <svg> a width and height (for example in mm) or a viewBox.');
  }
  if (!(widthMm > 0 && heightMm > 0 && Number.isFinite(widthMm) && Number.isFinite(heightMm))) {
    throw new TallyError('raster-invalid', 'The SVG page must have a positive, finite width and height.');
  }
  return { widthMm, heightMm, widthCssPx: widthMm / MM_PER_CSS_PX, heightCssPx: heightMm / MM_PER_CSS_PX };
}

/** The page size the root <svg> declares, in mm (CSS absolute units; unitless = px; viewBox as fallback). */
export function readSvgPageSize(svg: string): SvgPageSize {
  return pageSizeFromAttributes(scanSvg(svg, true).attributes);
}

/**
 * Nominal pixel size of a page at a resolution: round(size in mm x ppi / 25.4) per side, to the nearest
 * integer; 100 x 50 mm at 300 ppi is 1181.10 x 590.55, so 1181 x 591 px. The rendered width is exactly this;
 * the rendered height follows the width's scale (see renderSvgPixels). Used for the size limits.
 */
export function rasterSizePx(page: Pick<SvgPageSize, 'widthMm' | 'heightMm'>, ppi: number): { widthPx: number; heightPx: number } {
  if (!Number.isFinite(ppi) || ppi <= 0) {
    throw new TallyError('raster-invalid', `The resolution must be a positive number of pixels per inch (got ${ppi}).`);
  }
  return {
    widthPx: Math.round((page.widthMm * ppi) / MM_PER_INCH),
    heightPx: Math.round((page.heightMm * ppi) / MM_PER_INCH),
  };
}

function checkLimits(page: SvgPageSize, ppi: number, widthPx: number, heightPx: number, maxSidePx: number, maxPixels: number): void {
  if (widthPx < 1 || heightPx < 1) {
    throw new TallyError('raster-invalid', `At ${ppi} ppi the page (${fmt(page.widthMm)} x ${fmt(page.heightMm)} mm) is less than one pixel across; choose a higher resolution.`);
  }
  if (widthPx <= maxSidePx && heightPx <= maxSidePx && widthPx * heightPx <= maxPixels) return;
  const bySide = (maxSidePx * MM_PER_INCH) / Math.max(page.widthMm, page.heightMm);
  const byArea = Math.sqrt((maxPixels * MM_PER_INCH * MM_PER_INCH) / (page.widthMm * page.heightMm));
  const maxPpi = Math.floor(Math.min(bySide, byArea));
  throw new TallyError(
    'geometry-limit',
    `At ${ppi} ppi this ${fmt(page.widthMm)} x ${fmt(page.heightMm)} mm page would be ${widthPx} x ${heightPx} pixels, beyond the limit of ` +
      `${maxSidePx} pixels a side and ${Math.round(maxPixels / 1e6)} million pixels; choose a lower resolution (at most ${maxPpi} ppi for this page).`,
  );
}

function fmt(n: number): string {
  return String(Math.round(n * 100) / 100);
}

function makeRenderer(svg: string, options: RasterOptions): { resvg: Resvg; page: SvgPageSize; ppi: number; widthPx: number } {
  const ppi = options.ppi ?? 300;
  const page = pageSizeFromAttributes(scanSvg(svg, options.allowExternalFiles ?? false).attributes);
  const { widthPx, heightPx } = rasterSizePx(page, ppi);
  checkLimits(page, ppi, widthPx, heightPx, options.maxSidePx ?? RASTER_LIMITS.maxSidePx, options.maxPixels ?? RASTER_LIMITS.maxPixels);
  let resvg: Resvg;
  try {
    resvg = new Resvg(svg, {
      fitTo: { mode: 'width', value: widthPx },
      font: { loadSystemFonts: false },
      ...(options.background !== undefined ? { background: options.background } : {}),
    });
  } catch (e) {
    throw new TallyError('svg-malformed', `The SVG could not be read for rendering: ${(e as Error).message}`);
  }
  // resvg reports its page size rounded to whole px; a larger gap means it read the size differently from us.
  if (Math.abs(resvg.width - page.widthCssPx) > 1 || Math.abs(resvg.height - page.heightCssPx) > 1) {
    throw new TallyError(
      'raster-invalid',
      `The renderer read the page as ${resvg.width} x ${resvg.height} px but its width and height say ${fmt(page.widthCssPx)} x ${fmt(page.heightCssPx)} px; check the root <svg> size.`,
    );
  }
  return { resvg, page, ppi, widthPx };
}

/**
 * Renders to premultiplied RGBA without encoding a PNG (for measuring). The canvas is widthPx wide
 * (see rasterSizePx) and both axes share one scale, widthPx / widthMm; resvg derives the height from that
 * scale, so on small rasters it can differ by a pixel from round(heightMm x ppi / 25.4).
 */
export function renderSvgPixels(svg: string, options: Omit<RasterOptions, 'keepPixels'> = {}): RasterPixels {
  const { resvg, page } = makeRenderer(svg, options);
  const image = resvg.render();
  // Every read of .pixels copies the whole raster: read it once.
  const pixels = image.pixels;
  return { widthPx: image.width, heightPx: image.height, pixels, page, mmPerPx: page.widthMm / image.width };
}

/** Renders an SVG to a PNG at `ppi` (default 300) and records that resolution in the PNG's pHYs chunk. */
export function rasterizeSvg(svg: string, options: RasterOptions = {}): RasterResult {
  const { resvg, page, ppi } = makeRenderer(svg, options);
  const image = resvg.render();
  // Every read of .pixels copies the whole raster: read it once, for the encoder and the caller alike.
  const pixels = image.pixels;
  const png = withPhysChunk(encodePng(pixels, image.width, image.height), ppi);
  return { png, widthPx: image.width, heightPx: image.height, ppi, mmPerPx: page.widthMm / image.width, ...(options.keepPixels ? { pixels } : {}) };
}

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

function pngChunk(type: string, data: Uint8Array): Buffer {
  const out = Buffer.alloc(12 + data.length);
  out.writeUInt32BE(data.length, 0);
  out.write(type, 4, 'latin1');
  out.set(data, 8);
  out.writeUInt32BE(pngCrc32(out.subarray(4, 8 + data.length)), 8 + data.length);
  return out;
}

/**
 * Premultiplied RGBA (resvg's pixels) as an 8-bit RGBA PNG (PNG spec: colour type 6, filter 0 on every row).
 * Colours are un-premultiplied as resvg's own encoder does (tiny-skia's demultiply: c / (a / 255) + 0.5,
 * truncated), so the pixels are the same; only the compression differs: zlib at a fast level, which on a chart
 * page of flat colours is smaller than resvg's default encoding and several times faster (see npm run bench).
 */
export function encodePng(premultiplied: Uint8Array, widthPx: number, heightPx: number): Buffer {
  if (premultiplied.length !== widthPx * heightPx * 4) {
    throw new TallyError('raster-invalid', `The pixel buffer (${premultiplied.length} bytes) does not match a ${widthPx} x ${heightPx} RGBA image.`);
  }
  const stride = widthPx * 4 + 1;
  // Rows are filtered and compressed a band at a time, so the whole filtered image never sits in memory beside
  // the pixels: each band is raw deflate ending on a full flush (byte-aligned, no history carried), and the
  // bands joined are one deflate stream (RFC 1951), wrapped in a zlib header and Adler-32 (RFC 1950).
  const bandRows = Math.max(1, Math.floor(PNG_BAND_BYTES / stride));
  const band = Buffer.allocUnsafe(Math.min(heightPx, bandRows) * stride);
  const parts: Buffer[] = [Buffer.from([0x78, 0x5e])];
  let adlerA = 1;
  let adlerB = 0;
  for (let y0 = 0; y0 < heightPx; y0 += bandRows) {
    const y1 = Math.min(heightPx, y0 + bandRows);
    let o = 0;
    for (let y = y0; y < y1; y++) {
      band[o++] = 0; // filter type None
      let i = y * widthPx * 4;
      const end = i + widthPx * 4;
      for (; i < end; i += 4, o += 4) {
        const a = premultiplied[i + 3];
        if (a === 255) {
          band[o] = premultiplied[i];
          band[o + 1] = premultiplied[i + 1];
          band[o + 2] = premultiplied[i + 2];
          band[o + 3] = 255;
        } else if (a === 0) {
          band[o] = 0;
          band[o + 1] = 0;
          band[o + 2] = 0;
          band[o + 3] = 0;
        } else {
          const k = a / 255;
          band[o] = Math.min(255, Math.trunc(premultiplied[i] / k + 0.5));
          band[o + 1] = Math.min(255, Math.trunc(premultiplied[i + 1] / k + 0.5));
          band[o + 2] = Math.min(255, Math.trunc(premultiplied[i + 2] / k + 0.5));
          band[o + 3] = a;
        }
      }
    }
    const chunk = band.subarray(0, o);
    // Adler-32 (RFC 1950 §9): sums mod 65521, reduced every 5552 bytes so they stay exact in doubles.
    for (let i = 0; i < chunk.length; ) {
      const stop = Math.min(chunk.length, i + 5552);
      for (; i < stop; i++) {
        adlerA += chunk[i];
        adlerB += adlerA;
      }
      adlerA %= 65521;
      adlerB %= 65521;
    }
    const last = y1 === heightPx;
    parts.push(deflateRawSync(chunk, { level: PNG_DEFLATE_LEVEL, finishFlush: last ? zlibConstants.Z_FINISH : zlibConstants.Z_FULL_FLUSH }));
  }
  const trailer = Buffer.alloc(4);
  trailer.writeUInt32BE(((adlerB << 16) | adlerA) >>> 0, 0);
  parts.push(trailer);
  const header = Buffer.alloc(13);
  header.writeUInt32BE(widthPx, 0);
  header.writeUInt32BE(heightPx, 4);
  header[8] = 8; // bit depth
  header[9] = 6; // RGBA
  return Buffer.concat([Buffer.from(PNG_SIGNATURE), pngChunk('IHDR', header), pngChunk('IDAT', Buffer.concat(parts)), pngChunk('IEND', new Uint8Array(0))]);
}

/** Filtered bytes compressed at a time (a band of whole rows): about 4 MB. */
const PNG_BAND_BYTES = 4 * 1024 * 1024;

/** zlib level for PNG data: 3 of 9 (fast, and flat chart colours compress well at any level). */
const PNG_DEFLATE_LEVEL = 3;
