// Which reading a mark's geometry invites, in words a client can follow: both sides growing
// together reads as area, one side as length, copies of one glyph as a count, and a solid-looking
// drawing also as volume.
import type { RepeatUnit } from './findRepeatUnit';
import type { MeasuredMark, ReadingName, SolidCue } from './types';

export interface ReadingSuggestion {
  suggested: ReadingName;
  /** The drawing looks three-dimensional, so a volume reading is likely as well. */
  volumeReadable: boolean;
  /** Largest over smallest box width and height across the marks. */
  widthRatio: number;
  heightRatio: number;
  /** For a length reading, the side that varies. */
  dimension?: 'height' | 'width';
  solidCues: SolidCue[];
  /** Plain sentences: what changes in the drawing, and so what a reader compares. */
  reasons: string[];
}

/** Sizes within 2% of each other read as the same size. Common practice, no source. */
const SAME_SIZE = Math.log(1.02);
/** One side counts as fixed when it changes less than a quarter as much (in log terms) as the other. Common practice, no source. */
const ONE_SIDE = 0.25;

const CUE_WORDS: Record<SolidCue, string> = {
  'parallelogram-faces': 'a top or side face drawn as a slanted parallelogram, as on a box',
  'elliptic-cap': 'an elliptical top on a body of the same width, as on a barrel or a cylinder',
  'shaded-faces': 'faces painted in lighter and darker tones of one colour, like light and shade',
  declared: 'the person who supplied the file says it is drawn in 3-D',
};

function ratio(values: number[]): number {
  const pos = values.filter((v) => v > 0);
  return pos.length ? Math.max(...pos) / Math.min(...pos) : 1;
}

export function times(x: number): string {
  return `×${x >= 10 ? x.toFixed(1) : x.toFixed(2)}`;
}

function joinWords(items: string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join('; ')}; and ${items[items.length - 1]}`;
}

export function suggestReading(marks: readonly MeasuredMark[], unit: RepeatUnit | null, opts: { solid?: boolean } = {}): ReadingSuggestion {
  const widthRatio = ratio(marks.map((m) => m.box.width));
  const heightRatio = ratio(marks.map((m) => m.box.height));
  const lw = Math.log(widthRatio), lh = Math.log(heightRatio);
  const cues = new Set<SolidCue>(marks.flatMap((m) => m.solidCues));
  if (opts.solid) cues.add('declared');
  const solidCues = [...cues];
  const volumeReadable = solidCues.length > 0;
  const reasons: string[] = [];
  let suggested: ReadingName;
  let dimension: 'height' | 'width' | undefined;

  const maxRepeats = unit ? Math.max(...unit.perMark.map((p) => p.repeats)) : 0;
  const countable = unit !== null && maxRepeats >= 2;
  if (countable) {
    suggested = 'count';
    reasons.push(`Each mark is built from copies of one small picture (up to ${maxRepeats} in a mark), so readers count the pictures rather than measure them.`);
  } else if (lw < SAME_SIZE && lh < SAME_SIZE) {
    suggested = 'area';
    reasons.push('All the marks are drawn at the same size, so readers see the values as equal: whatever they compare, length or area, is the same for every mark.');
  } else if (Math.min(lw, lh) < SAME_SIZE || Math.min(lw, lh) <= ONE_SIDE * Math.max(lw, lh)) {
    suggested = 'length';
    dimension = lh >= lw ? 'height' : 'width';
    const other = dimension === 'height' ? 'width' : 'height';
    const otherRatio = dimension === 'height' ? widthRatio : heightRatio;
    const grows = dimension === 'height' ? heightRatio : widthRatio;
    const still = otherRatio < 1.02 ? 'stays the same' : `changes much less (${times(otherRatio)})`;
    reasons.push(`From the smallest mark to the largest, the ${dimension} grows ${times(grows)} while the ${other} ${still}. When only one side changes, readers compare that side, as they would bars, so the marks are read by their ${dimension}.`);
  } else {
    suggested = 'area';
    reasons.push(`From the smallest mark to the largest, the width grows ${times(widthRatio)} and the height ${times(heightRatio)}. When a picture grows in both directions at once, readers judge how much space it covers, so it is read by its area.`);
  }
  if (volumeReadable) {
    reasons.push(
      `The pictures also look solid (${joinWords(solidCues.map((c) => CUE_WORDS[c]))}), so many readers will see objects and compare their volumes, which grow faster still (width × width × height). No single scaling keeps area and volume honest at once: a flat drawing avoids the problem.`,
    );
  }
  const out: ReadingSuggestion = { suggested, volumeReadable, widthRatio, heightRatio, solidCues, reasons };
  if (dimension) out.dimension = dimension;
  return out;
}
