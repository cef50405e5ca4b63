// The data for a supplied graphic: values the user gives (in mark order, or by mark id), values
// read from the file's own labels or data attributes, with the user's word winning.
import { TallyError } from '../errors';
import type { LabelPairing } from './pairLabels';

export type ValueSpec =
  | { kind: 'ordered'; values: number[] }
  | { kind: 'named'; values: Record<string, number> };

function readNumber(text: string, where: string): number {
  const t = text.trim();
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(t)) {
    throw new TallyError('usage', `${where}: "${t.slice(0, 40)}" is not a number (write values like 18 or 27.5, without units or thousands separators).`);
  }
  const v = Number(t);
  if (!Number.isFinite(v)) throw new TallyError('usage', `${where}: "${t.slice(0, 40)}" is not a finite number.`);
  return v;
}

/** `18,27.5` (in mark order) or `mark-a=18,mark-b=27.5` (by mark id). */
export function parseValueSpec(text: string): ValueSpec {
  const items = text.split(',').map((s) => s.trim());
  if (items.every((s) => s === '')) throw new TallyError('usage', 'No values were given; write them like --values 18,27.5 or --values mark-a=18,mark-b=27.5.');
  // A doubled or trailing comma would otherwise shift every later value onto the wrong mark.
  const empty = items.findIndex((s) => s === '');
  if (empty >= 0) {
    throw new TallyError('usage', `Item ${empty + 1} of ${items.length} in the values is empty (two commas in a row, or a comma at the start or end); give one number per mark, like --values 18,27.5.`);
  }
  const named = items.filter((s) => s.includes('='));
  if (named.length && named.length !== items.length) {
    throw new TallyError('usage', 'Give the values either all in mark order (18,27.5) or all by mark id (mark-a=18,mark-b=27.5), not mixed.');
  }
  if (!named.length) return { kind: 'ordered', values: items.map((s, i) => readNumber(s, `Value ${i + 1}`)) };
  const values: Record<string, number> = {};
  for (const s of items) {
    const i = s.indexOf('=');
    const id = s.slice(0, i).trim();
    if (!id) throw new TallyError('usage', `"${s.slice(0, 40)}" names no mark before the "=".`);
    if (id in values) throw new TallyError('usage', `The mark "${id.slice(0, 60)}" is given two values.`);
    values[id] = readNumber(s.slice(i + 1), `The value for "${id.slice(0, 60)}"`);
  }
  return { kind: 'named', values };
}

export type ValueSource = 'user' | 'label' | 'file';

export interface ResolvedValue {
  value: number;
  from: ValueSource;
  /** The label text the value was read from. */
  labelText?: string;
}

/** How the marks of a supplied graphic can be picked: by element id in an SVG, by a point inside each in an image. */
export type MarkPicking = 'svg-ids' | 'image-seeds';

const PICK_MARKS_HINT: Record<MarkPicking, string> = {
  'svg-ids': 'Give one value per mark in document order, or name the marks (--values id=value,...) or pick them (--marks id,id).',
  'image-seeds':
    'Give one value per mark in reading order, or name the marks (--values mark-1=18,...), or pick the marks with a point inside each (--seed x,y, once per mark); ' +
    '--tolerance and --gap change which pieces of the image count as one mark.',
};

/** One value per mark. The user's values win; then values recorded on the marks in the file; then labels paired with marks. */
export function resolveValues(
  marks: readonly { id: string; fileValue?: number }[],
  spec: ValueSpec | null,
  pairings: readonly LabelPairing[],
  picking: MarkPicking = 'svg-ids',
): ResolvedValue[] {
  if (spec?.kind === 'ordered') {
    if (spec.values.length !== marks.length) {
      throw new TallyError(
        'usage',
        `${spec.values.length} value(s) were given but the ${picking === 'image-seeds' ? 'image' : 'graphic'} has ${marks.length} mark(s) (${marks.map((m) => m.id).join(', ').slice(0, 200)}). ` +
          PICK_MARKS_HINT[picking],
      );
    }
    return spec.values.map((value) => ({ value, from: 'user' }));
  }
  if (spec?.kind === 'named') {
    const known = new Set(marks.map((m) => m.id));
    const unknown = Object.keys(spec.values).filter((id) => !known.has(id));
    if (unknown.length) throw new TallyError('usage', `There is no mark "${unknown[0].slice(0, 60)}"; the marks are ${marks.map((m) => m.id).join(', ').slice(0, 200)}.`);
  }
  const byMark = new Map(pairings.map((p) => [p.mark, p]));
  const missing: string[] = [];
  const out = marks.map((m): ResolvedValue => {
    if (spec?.kind === 'named' && m.id in spec.values) return { value: spec.values[m.id], from: 'user' };
    // A value the file records on the mark itself is exact; a label is only paired by distance.
    if (m.fileValue !== undefined) return { value: m.fileValue, from: 'file' };
    const p = byMark.get(m.id);
    if (p) return { value: p.value, from: 'label', labelText: p.text };
    missing.push(m.id);
    return { value: NaN, from: 'user' };
  });
  if (missing.length) {
    throw new TallyError(
      'usage',
      `No value is known for ${missing.length === 1 ? 'mark' : 'marks'} ${missing.join(', ').slice(0, 200)}: no number label was found near ${missing.length === 1 ? 'it' : 'them'}. ` +
        'Give the values with --values (in mark order, or as id=value).',
    );
  }
  return out;
}
