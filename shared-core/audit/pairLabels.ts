// Reads numbers from text labels and pairs each with the mark it describes: a label inside a mark's
// group belongs to it; otherwise labels and marks are paired nearest first, one label per mark.
import type { Box } from '../geometry/region';
import type { XmlElement } from '../svg/parseXml';

export interface LabelCandidate {
  text: string;
  xUnits: number;
  yUnits: number;
  sizeUnits: number;
  chain?: readonly XmlElement[];
}

export interface PairableMark {
  id: string;
  box: Box;
  elements?: readonly XmlElement[];
}

export interface LabelPairing {
  mark: string;
  /** The label's text as written (trimmed). */
  text: string;
  value: number;
  /** Distance from the label's anchor to the mark's box, in source units (0 inside the box or the mark's group). */
  distanceUnits: number;
}

export interface LabelPairs {
  pairs: LabelPairing[];
  /** Numeric labels that were not paired with any mark. */
  unpaired: string[];
}

const MULTIPLIER: Record<string, number> = { k: 1e3, K: 1e3, thousand: 1e3, M: 1e6, m: 1e6, million: 1e6, mn: 1e6, bn: 1e9, B: 1e9, billion: 1e9 };
const NUMBER = /([$€£¥]\s*)?([+\-−]?)(\d{1,3}(?:,\d{3})+(?:\.\d+)?|\d+(?:\.\d+)?|\.\d+)\s*(%|(?:thousand|million|billion|mn|bn|k|K|M|B)(?![A-Za-z]))?/g;

/** A year on its own ("1979") names a category, not an amount. Common practice, no source. */
function looksLikeYear(text: string): boolean {
  return /^\s*(1[6-9]|20)\d\d\s*$/.test(text);
}

/**
 * The amount a label states: "$14.54" → 14.54, "1,200" → 1200, "27.5%" → 27.5, "2.4 million" → 2400000.
 * With several numbers, one marked as an amount (currency or percent) wins, else the last. Null for none.
 */
export function parseLabelNumber(text: string): number | null {
  const found: { value: number; marked: boolean }[] = [];
  NUMBER.lastIndex = 0;
  for (let m = NUMBER.exec(text); m; m = NUMBER.exec(text)) {
    const raw = m[3].replace(/,/g, '');
    let v = Number(raw);
    if (!Number.isFinite(v)) continue;
    if (m[2] === '-' || m[2] === '−') v = -v;
    const suffix = m[4];
    // "m" after a number is more often metres than millions; only the capital M, "mn" and words scale.
    if (suffix && suffix !== '%' && suffix !== 'm') v *= MULTIPLIER[suffix];
    found.push({ value: v, marked: Boolean(m[1]) || suffix === '%' });
  }
  if (!found.length) return null;
  return (found.find((f) => f.marked) ?? found[found.length - 1]).value;
}

function distanceToBox(x: number, y: number, b: Box): number {
  const dx = Math.max(b.x - x, 0, x - (b.x + b.width));
  const dy = Math.max(b.y - y, 0, y - (b.y + b.height));
  return Math.hypot(dx, dy);
}

/**
 * One label per mark and one mark per label. A label counts as near a mark when it is within the
 * mark's own size (its larger side) or four text heights of its box. Common practice, no source.
 */
export function pairLabels(marks: readonly PairableMark[], labels: readonly LabelCandidate[]): LabelPairs {
  const numeric = labels.map((l) => ({ l, value: parseLabelNumber(l.text) })).filter((x) => x.value !== null) as { l: LabelCandidate; value: number }[];
  const amounts = numeric.some((x) => !looksLikeYear(x.l.text)) ? numeric.filter((x) => !looksLikeYear(x.l.text)) : numeric;
  const options: { mi: number; li: number; d: number; inside: boolean }[] = [];
  amounts.forEach((x, li) => {
    marks.forEach((m, mi) => {
      const inside = Boolean(m.elements && x.l.chain && m.elements.some((e) => x.l.chain?.includes(e)));
      const d = inside ? 0 : distanceToBox(x.l.xUnits, x.l.yUnits, m.box);
      const reach = Math.max(m.box.width, m.box.height, 4 * x.l.sizeUnits);
      if (inside || d <= reach) options.push({ mi, li, d, inside });
    });
  });
  options.sort((a, b) => Number(b.inside) - Number(a.inside) || a.d - b.d || a.mi - b.mi);
  const markTaken = new Set<number>();
  const labelTaken = new Set<number>();
  const pairs: LabelPairing[] = [];
  for (const o of options) {
    if (markTaken.has(o.mi) || labelTaken.has(o.li)) continue;
    markTaken.add(o.mi);
    labelTaken.add(o.li);
    pairs.push({ mark: marks[o.mi].id, text: amounts[o.li].l.text, value: amounts[o.li].value, distanceUnits: o.d });
  }
  const order = new Map(marks.map((m, i) => [m.id, i]));
  pairs.sort((a, b) => (order.get(a.mark) ?? 0) - (order.get(b.mark) ?? 0));
  const unpaired = amounts.filter((_, li) => !labelTaken.has(li)).map((x) => x.l.text);
  return { pairs, unpaired };
}
