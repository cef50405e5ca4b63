// Renders PDF bytes with Debian's poppler (`pdftoppm`), a renderer independent of pdfkit and resvg,
// and reads its PGM/PPM output back as pixels.
import { execFile } from 'node:child_process';
import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { TallyError } from '../../shared-core/errors';

export interface PopplerPage {
  widthPx: number;
  heightPx: number;
  /** 1 (gray) or 3 (RGB) samples per pixel, 8 bits each, row by row. */
  channels: 1 | 3;
  samples: Uint8Array;
}

/** Poppler's rasteriser; an absolute path on Debian, overridable for other systems. */
export function pdftoppmPath(): string {
  return process.env.TALLYGLYPH_PDFTOPPM ?? 'pdftoppm';
}

/** Parses a binary PGM (P5) or PPM (P6) file with maxval 255, as pdftoppm writes them (Netpbm formats). */
export function readNetpbm(bytes: Uint8Array): PopplerPage {
  let at = 0;
  const token = (): string => {
    // Whitespace and # comments separate header fields (Netpbm: pgm(5), ppm(5)).
    for (;;) {
      while (at < bytes.length && /\s/.test(String.fromCharCode(bytes[at]))) at++;
      if (bytes[at] === 0x23) {
        while (at < bytes.length && bytes[at] !== 0x0a) at++;
        continue;
      }
      break;
    }
    let s = '';
    while (at < bytes.length && !/\s/.test(String.fromCharCode(bytes[at]))) s += String.fromCharCode(bytes[at++]);
    return s;
  };
  const magic = token();
  if (magic !== 'P5' && magic !== 'P6') throw new TallyError('raster-invalid', `The PDF renderer wrote an image of an unexpected kind (${magic.slice(0, 4)}).`);
  const widthPx = Number(token());
  const heightPx = Number(token());
  const maxval = Number(token());
  at += 1; // exactly one whitespace byte before the samples
  const channels = magic === 'P5' ? 1 : 3;
  if (!Number.isInteger(widthPx) || !Number.isInteger(heightPx) || maxval !== 255 || bytes.length - at < widthPx * heightPx * channels) {
    throw new TallyError('raster-invalid', 'The PDF renderer wrote a truncated or unexpected image.');
  }
  return { widthPx, heightPx, channels, samples: bytes.subarray(at, at + widthPx * heightPx * channels) };
}

/**
 * Every page of `pdf` rendered by pdftoppm at `ppi` with anti-aliasing, in gray or RGB. Runs with a time
 * limit; a missing pdftoppm is a TallyError that says what to install.
 */
export async function renderPdfPages(pdf: Uint8Array, options: { ppi: number; gray: boolean; timeoutMs?: number }): Promise<PopplerPage[]> {
  const dir = await fs.mkdtemp(path.join(os.tmpdir(), 'tallyglyph-pdf-'));
  try {
    const input = path.join(dir, 'in.pdf');
    await fs.writeFile(input, pdf);
    const args = ['-r', String(options.ppi), '-aa', 'yes', '-aaVector', 'yes', ...(options.gray ? ['-gray'] : []), input, path.join(dir, 'page')];
    await new Promise<void>((resolve, reject) => {
      execFile(pdftoppmPath(), args, { timeout: options.timeoutMs ?? 120_000, maxBuffer: 1024 * 1024 }, (error, _stdout, stderr) => {
        if (!error) return resolve();
        const code = (error as NodeJS.ErrnoException).code;
        if (code === 'ENOENT') {
          reject(new TallyError('checker-missing', 'Cannot check the PDF: poppler\'s "pdftoppm" is not installed (Debian: apt-get install poppler-utils). Nothing was written.'));
        } else {
          reject(new TallyError('pdf-invalid', `The PDF could not be rendered for checking: ${String(stderr || error.message).trim().slice(0, 300)}`));
        }
      });
    });
    // pdftoppm names pages page-1.pgm … or page-01.pgm … (zero-padded to the page count's digits).
    const names = (await fs.readdir(dir)).filter((n) => /^page-\d+\.p[gp]m$/.test(n));
    names.sort((a, b) => Number(/(\d+)\./.exec(a)?.[1]) - Number(/(\d+)\./.exec(b)?.[1]));
    const pages: PopplerPage[] = [];
    for (const name of names) pages.push(readNetpbm(new Uint8Array(await fs.readFile(path.join(dir, name)))));
    return pages;
  } finally {
    await fs.rm(dir, { recursive: true, force: true });
  }
}

/** Ink on a gray page of black ink on white paper, in pixel units: the sum of (255 − gray) / 255. */
export function grayInkPx(page: PopplerPage): number {
  if (page.channels !== 1) throw new TallyError('raster-invalid', 'Ink is measured on gray pages.');
  let total = 0;
  for (let i = 0; i < page.samples.length; i++) total += 255 - page.samples[i];
  return total / 255;
}
