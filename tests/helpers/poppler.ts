// Debian's poppler-utils as an independent reader of PDF files: pdfinfo for page boxes, pdffonts for
// embedded fonts. Tests that need them use describe.skipIf(!hasPoppler).
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

export const hasPoppler = ['pdftoppm', 'pdfinfo', 'pdffonts'].every((c) => {
  const r = spawnSync(c, ['-v'], { stdio: 'ignore', timeout: 10_000 });
  return !r.error && r.status === 0;
});

function onDisk<T>(pdf: Uint8Array, work: (file: string) => T): T {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-poppler-'));
  try {
    const file = path.join(dir, 'in.pdf');
    fs.writeFileSync(file, pdf);
    return work(file);
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

function run(command: string, args: string[]): string {
  const r = spawnSync(command, args, { encoding: 'utf8', timeout: 60_000 });
  if (r.error) throw r.error;
  if (r.status !== 0) throw new Error(`${command} failed: ${r.stderr}`);
  return r.stdout;
}

export interface PdfBoxes {
  pages: number;
  /** Boxes in PDF points as pdfinfo -box prints them: [x0, y0, x1, y1]. */
  mediaBox: number[];
  trimBox: number[];
  bleedBox: number[];
  pdfVersion: string;
  title: string | null;
}

/** What pdfinfo says about page 1's boxes (pdfinfo prints points; 1 mm = 72 / 25.4 pt). */
export function pdfinfoBoxes(pdf: Uint8Array): PdfBoxes {
  const out = onDisk(pdf, (file) => run('pdfinfo', ['-box', file]));
  const box = (name: string) => (new RegExp(`^${name}:\\s+(.*)$`, 'm').exec(out)?.[1] ?? '').trim().split(/\s+/).map(Number);
  return {
    pages: Number(/^Pages:\s+(\d+)/m.exec(out)?.[1]),
    mediaBox: box('MediaBox'),
    trimBox: box('TrimBox'),
    bleedBox: box('BleedBox'),
    pdfVersion: /^PDF version:\s+(\S+)/m.exec(out)?.[1] ?? '',
    title: /^Title:\s+(.*)$/m.exec(out)?.[1] ?? null,
  };
}

/** Font names pdffonts lists for the whole file (none when all text is outlines). */
export function pdffontsNames(pdf: Uint8Array): string[] {
  const lines = onDisk(pdf, (file) => run('pdffonts', [file])).split('\n');
  // Two header lines (names, dashes), then one line per font.
  return lines.slice(2).filter((l) => l.trim()).map((l) => l.split(/\s+/)[0]);
}
