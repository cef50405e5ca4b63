// Command-line words for the audit commands: seed points, two-point lengths and numbers, read strictly.
import fs from 'node:fs';
import path from 'node:path';
import { parseAnchor, type CorrectOptions } from '../../shared-core/audit/correctSvg';
import { TallyError } from '../../shared-core/errors';
import { readSuppliedFile } from './readSupplied';

/** parseArgs options that audit, correct and sheet all take: the data and which elements are the marks. */
export const MARK_OPTIONS = { values: { type: 'string' }, marks: { type: 'string' } } as const;

/** parseArgs options that correct and sheet add: the reading to make honest, the fixed point, the output file. */
export const CORRECTION_OPTIONS = {
  ...MARK_OPTIONS,
  reading: { type: 'string' },
  anchor: { type: 'string' },
  output: { type: 'string', short: 'o' },
} as const;

export interface CorrectionFlags {
  values?: string;
  marks?: string;
  reading?: string;
  anchor?: string;
}

/**
 * What correct and sheet do alike before correcting: check --reading, read the supplied file (it must be
 * an SVG; `notSvg` is the sentence when it is not) and turn the flags into correctSvg's options.
 */
export function readCorrectionRequest(flags: CorrectionFlags, input: string, notSvg: string): { text: string; options: CorrectOptions } {
  const reading = flags.reading;
  if (reading !== undefined && reading !== 'area' && reading !== 'length' && reading !== 'volume') {
    throw new TallyError('usage', `--reading must be area, length or volume (got "${reading.slice(0, 30)}").`);
  }
  const file = readSuppliedFile(input);
  if (file.kind !== 'svg') throw new TallyError('usage', notSvg);
  return {
    text: file.text,
    options: {
      values: flags.values,
      markIds: parseIdList(flags.marks),
      ...(reading ? { reading } : {}),
      ...(flags.anchor ? { anchor: parseAnchor(flags.anchor) } : {}),
    },
  };
}

function numbers(text: string, count: number, what: string): number[] {
  const parts = text.split(',').map((s) => s.trim());
  const out = parts.map(Number);
  if (parts.length !== count || parts.some((p) => p === '') || out.some((n) => !Number.isFinite(n))) {
    throw new TallyError('usage', `${what} "${text.slice(0, 60)}" should be ${count} numbers separated by commas.`);
  }
  return out;
}

/** `--seed x,y` (pixels), in mark order. */
export function parseSeeds(items: readonly string[] | undefined): Array<{ xPx: number; yPx: number }> | undefined {
  if (!items || !items.length) return undefined;
  return items.map((s) => {
    const [x, y] = numbers(s, 2, 'The seed point');
    return { xPx: x, yPx: y };
  });
}

/** `--length x1,y1,x2,y2` in mark order, or `--length id=x1,y1,x2,y2`; each becomes the distance between the points. */
export function parseLengths(items: readonly string[] | undefined): number[] | Record<string, number> | undefined {
  if (!items || !items.length) return undefined;
  const named = items.filter((s) => s.includes('='));
  if (named.length && named.length !== items.length) throw new TallyError('usage', 'Give the lengths either all in mark order or all as id=x1,y1,x2,y2, not mixed.');
  const dist = (s: string) => {
    const [x1, y1, x2, y2] = numbers(s, 4, 'The length');
    return Math.hypot(x2 - x1, y2 - y1);
  };
  if (!named.length) return items.map(dist);
  const out: Record<string, number> = {};
  for (const s of items) {
    const i = s.indexOf('=');
    out[s.slice(0, i).trim()] = dist(s.slice(i + 1));
  }
  return out;
}

export function parseNumberFlag(text: string | undefined, what: string): number | undefined {
  if (text === undefined) return undefined;
  const n = Number(text);
  if (text.trim() === '' || !Number.isFinite(n)) throw new TallyError('usage', `${what} must be a number (got "${text.slice(0, 30)}").`);
  return n;
}

export function parseIdList(text: string | undefined): string[] | undefined {
  if (text === undefined) return undefined;
  const ids = text.split(',').map((s) => s.trim()).filter(Boolean);
  if (!ids.length) throw new TallyError('usage', 'The list of mark ids is empty.');
  return ids;
}

/** True when two paths name one file (also through links); a missing file is never the same as another. */
export function sameFile(a: string, b: string): boolean {
  if (path.resolve(a) === path.resolve(b)) return true;
  try {
    return fs.realpathSync(a) === fs.realpathSync(b);
  } catch {
    return false;
  }
}
