// Checks that do not trust this project's code: Debian's rsvg-convert (librsvg, a renderer independent of resvg),
// xmllint against the W3C SVG 1.1 DTD, pngcheck (an independent PNG chunk decoder), and plain resvg calls.
// Each tool may be missing on a developer's machine: tests should use `describe.skipIf(!hasRsvg)` and friends.

import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PNG } from 'pngjs';
import { Resvg } from '@resvg/resvg-js';
import { isolateEachMark } from '../../main/raster/coverage';
import { readSvgPageSize } from '../../main/raster/rasterizeSvg';

/** Debian package w3c-sgml-lib; override with TALLYGLYPH_SVG11_DTD where it lives elsewhere. */
export const SVG11_DTD = process.env.TALLYGLYPH_SVG11_DTD ?? '/usr/share/xml/w3c-sgml-lib/schema/dtd/REC-SVG11-20110816/svg11.dtd';
/**
 * The XML catalog w3c-sgml-lib ships beside its DTDs (schema/dtd/catalog.xml); it maps the public identifier
 * "-//W3C//DTD SVG 1.1//EN" to REC-SVG11-20110816/svg11.dtd, so a DOCTYPE resolves offline.
 */
export const SVG11_CATALOG = path.join(path.dirname(path.dirname(SVG11_DTD)), 'catalog.xml');
const SVG11_PUBLIC_ID = /\bPUBLIC\s+(["'])-\/\/W3C\/\/DTD SVG 1\.1\/\/EN\1/;

function commandRuns(command: string, args: string[]): boolean {
  const result = spawnSync(command, args, { stdio: 'ignore', timeout: 10_000 });
  return !result.error && result.status === 0;
}

export const hasRsvg = commandRuns('rsvg-convert', ['--version']);
export const hasXmllint = commandRuns('xmllint', ['--version']) && fs.existsSync(SVG11_DTD) && fs.existsSync(SVG11_CATALOG);
export const hasPngcheck = commandRuns('pngcheck', ['-h']);

function withTempDir<T>(work: (dir: string) => T): T {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-check-'));
  try {
    return work(dir);
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

function run(command: string, args: string[], env: Record<string, string> = {}): { status: number | null; output: string } {
  const result = spawnSync(command, args, { encoding: 'utf8', timeout: 120_000, maxBuffer: 64 * 1024 * 1024, env: { ...process.env, ...env } });
  if (result.error) throw result.error;
  return { status: result.status, output: `${result.stdout ?? ''}${result.stderr ?? ''}` };
}

function sumAlpha(rgba: Uint8Array): number {
  let total = 0;
  for (let i = 3; i < rgba.length; i += 4) total += rgba[i];
  return total / 255;
}

/** Renders with rsvg-convert at a pixel width (height follows the aspect ratio unless given). RGBA is straight, not premultiplied. */
export function rsvgRender(svg: string, size: { widthPx: number; heightPx?: number }): { widthPx: number; heightPx: number; rgba: Uint8Array } {
  return withTempDir((dir) => {
    const input = path.join(dir, 'in.svg');
    const output = path.join(dir, 'out.png');
    fs.writeFileSync(input, svg);
    const args = ['-w', String(size.widthPx), ...(size.heightPx ? ['-h', String(size.heightPx)] : []), '-f', 'png', '-o', output, input];
    const { status, output: log } = run('rsvg-convert', args);
    if (status !== 0) throw new Error(`rsvg-convert failed (${status}): ${log}`);
    const decoded = PNG.sync.read(fs.readFileSync(output));
    return { widthPx: decoded.width, heightPx: decoded.height, rgba: new Uint8Array(decoded.data) };
  });
}

/** Ink in pixel units (sum of alpha / 255) as rsvg-convert renders it at `widthPx`. */
export function rsvgAlphaSum(svg: string, widthPx: number): number {
  return sumAlpha(rsvgRender(svg, { widthPx }).rgba);
}

/** Ink of each mark alone (the other marks hidden), by rsvg-convert; mm2 uses the page width over the pixel width. */
export function rsvgMarkCoverages(svg: string, markIds: readonly string[], widthPx: number): Array<{ id: string; px: number; mm2: number }> {
  const { widthMm } = readSvgPageSize(svg);
  return [...isolateEachMark(svg, markIds)].map(({ id, svg: variant }) => {
    const raster = rsvgRender(variant, { widthPx });
    const px = sumAlpha(raster.rgba);
    const mmPerPx = widthMm / raster.widthPx;
    return { id, px, mm2: px * mmPerPx * mmPerPx };
  });
}

/** Ink in pixel units as resvg renders it at `widthPx`, called directly (no project code in between). */
export function resvgAlphaSum(svg: string, widthPx: number): number {
  const image = new Resvg(svg, { fitTo: { mode: 'width', value: widthPx }, font: { loadSystemFonts: false } }).render();
  return sumAlpha(image.pixels);
}

/** The document's DOCTYPE declaration up to its internal subset, when it has one before the root element. */
function doctypeOf(svg: string): string | null {
  const m = /^\uFEFF?(?:\s|<\?[\s\S]*?\?>|<!--[\s\S]*?-->)*(<!DOCTYPE\b[^[>]*)/.exec(svg);
  return m ? m[1] : null;
}

/**
 * Validates against the SVG 1.1 (Second Edition) DTD with xmllint, offline (--nonet). A document with a DOCTYPE
 * is validated as it declares itself (--valid), so the declarations of its internal subset count too (SVG 1.1
 * allows extending the DTD there; our writer declares its data-* attributes that way, see docs/chart-svg.md);
 * the SVG 1.1 public identifier resolves through SVG11_CATALOG. A DOCTYPE naming any other DTD is not SVG 1.1
 * and is reported invalid without running xmllint. A document without a DOCTYPE is checked against svg11.dtd
 * with --dtdvalid, which validates against that external DTD alone (it would ignore an internal subset).
 */
export function xmllintValidateSvg11(svg: string): { valid: boolean; output: string } {
  const doctype = doctypeOf(svg);
  if (doctype !== null && !SVG11_PUBLIC_ID.test(doctype)) {
    return { valid: false, output: `The DOCTYPE does not name the SVG 1.1 DTD ("-//W3C//DTD SVG 1.1//EN"): ${doctype.slice(0, 160)}` };
  }
  return withTempDir((dir) => {
    const file = path.join(dir, 'check.svg');
    fs.writeFileSync(file, svg);
    const how = doctype === null ? ['--dtdvalid', SVG11_DTD] : ['--valid'];
    const { status, output } = run('xmllint', ['--noout', '--nonet', ...how, file], { XML_CATALOG_FILES: SVG11_CATALOG });
    return { valid: status === 0, output };
  });
}

/** pngcheck's verdict on a whole PNG file (structure and CRCs). */
export function pngcheckRun(png: Uint8Array): { ok: boolean; output: string } {
  return withTempDir((dir) => {
    const file = path.join(dir, 'check.png');
    fs.writeFileSync(file, png);
    const { status, output } = run('pngcheck', ['-v', file]);
    return { ok: status === 0, output };
  });
}

/** The pHYs chunk as pngcheck reads it, or null when it reports none. Throws if pngcheck finds the file broken. */
export function pngcheckPhys(png: Uint8Array): { ppmX: number; ppmY: number; unit: number } | null {
  const { ok, output } = pngcheckRun(png);
  if (!ok) throw new Error(`pngcheck rejected the PNG: ${output}`);
  const at = output.indexOf('chunk pHYs');
  if (at < 0) return null;
  // pngcheck -v prints e.g. "chunk pHYs at offset 0x00025, length 9: 11811x11811 pixels/meter (300 dpi)".
  const m = /(\d+)x(\d+) pixels\/(meter|unit)/.exec(output.slice(at));
  if (!m) throw new Error(`Could not read pngcheck's pHYs line: ${output.slice(at, at + 200)}`);
  return { ppmX: Number(m[1]), ppmY: Number(m[2]), unit: m[3] === 'meter' ? 1 : 0 };
}
