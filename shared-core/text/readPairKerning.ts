// Pair kerning read straight from a font's GPOS table. opentype.js 2.0.0 skips Extension (type 9)
// lookups, and Noto Sans keeps nearly all of its kerning there, so its own kerning comes out zero.
//
// Table layouts follow the OpenType specification (GPOS and "common table formats" chapters):
// ScriptList -> LangSys -> FeatureList ('kern') -> LookupList -> PairPos format 1 / format 2,
// possibly wrapped in an Extension subtable. Only the first glyph's XAdvance is applied, which is
// all horizontal Latin kerning uses; contextual (type 8) and mark lookups are not applied.

import { TallyError } from '../errors';

/** Kerning between two glyphs, in font units (negative pulls the right glyph closer). */
export type PairKerning = (leftGlyphIndex: number, rightGlyphIndex: number) => number;

type PairSubtable =
  | { format: 1; coverage: Map<number, number>; pairSets: Array<Map<number, number>> }
  | { format: 2; coverage: Map<number, number>; classDef1: Map<number, number>; classDef2: Map<number, number>; class1Count: number; class2Count: number; xAdvance: Int16Array };

const VALUE_X_ADVANCE = 0x0004;
const LOOKUP_PAIR = 2;
const LOOKUP_EXTENSION = 9;

/**
 * Builds a kerning function from sfnt bytes (TrueType or CFF flavoured OpenType). A font without a
 * GPOS table, or without a 'kern' feature for the script, kerns nothing.
 */
export function readPairKerning(sfnt: Uint8Array, scriptTag = 'latn'): PairKerning {
  let lookups: PairSubtable[][];
  try {
    lookups = readKernLookups(sfnt, scriptTag);
  } catch (e) {
    if (e instanceof TallyError) throw e;
    throw new TallyError('data-invalid', 'The font\'s kerning table is damaged and cannot be read.', e);
  }
  if (lookups.length === 0) return () => 0;
  return (left, right) => {
    let total = 0;
    // Lookups add up; inside one lookup the first subtable that applies wins (OpenType spec, "Lookup table").
    for (const subtables of lookups) {
      for (const subtable of subtables) {
        const value = applyPair(subtable, left, right);
        if (value !== undefined) {
          total += value;
          break;
        }
      }
    }
    return total;
  };
}

function applyPair(subtable: PairSubtable, left: number, right: number): number | undefined {
  const coverageIndex = subtable.coverage.get(left);
  if (coverageIndex === undefined) return undefined;
  if (subtable.format === 1) return subtable.pairSets[coverageIndex]?.get(right);
  // Format 2 applies to every covered first glyph: an unlisted second glyph is class 0.
  const class1 = subtable.classDef1.get(left) ?? 0;
  const class2 = subtable.classDef2.get(right) ?? 0;
  if (class1 >= subtable.class1Count || class2 >= subtable.class2Count) return undefined;
  return subtable.xAdvance[class1 * subtable.class2Count + class2];
}

function readKernLookups(sfnt: Uint8Array, scriptTag: string): PairSubtable[][] {
  const view = new DataView(sfnt.buffer, sfnt.byteOffset, sfnt.byteLength);
  const gpos = findTable(view, 'GPOS');
  if (gpos === undefined) return [];

  const scriptList = gpos + view.getUint16(gpos + 4);
  const featureList = gpos + view.getUint16(gpos + 6);
  const lookupList = gpos + view.getUint16(gpos + 8);

  const scripts = new Map<string, number>();
  const scriptCount = view.getUint16(scriptList);
  for (let i = 0; i < scriptCount; i++) {
    const record = scriptList + 2 + i * 6;
    scripts.set(readTag(view, record), scriptList + view.getUint16(record + 4));
  }
  const script = scripts.get(scriptTag) ?? scripts.get('DFLT');
  if (script === undefined) return [];
  const defaultLangSys = view.getUint16(script);
  if (defaultLangSys === 0) return [];
  const langSys = script + defaultLangSys;

  const lookupIndices = new Set<number>();
  const featureCount = view.getUint16(featureList);
  const featureIndexCount = view.getUint16(langSys + 4);
  for (let i = 0; i < featureIndexCount; i++) {
    const featureIndex = view.getUint16(langSys + 6 + i * 2);
    if (featureIndex >= featureCount) continue;
    const record = featureList + 2 + featureIndex * 6;
    if (readTag(view, record) !== 'kern') continue;
    const feature = featureList + view.getUint16(record + 4);
    const lookupCount = view.getUint16(feature + 2);
    for (let k = 0; k < lookupCount; k++) lookupIndices.add(view.getUint16(feature + 4 + k * 2));
  }

  // Lookups run in LookupList order, whatever order the feature lists them in.
  const lookupCount = view.getUint16(lookupList);
  const result: PairSubtable[][] = [];
  for (const index of [...lookupIndices].sort((a, b) => a - b)) {
    if (index >= lookupCount) continue;
    const lookup = lookupList + view.getUint16(lookupList + 2 + index * 2);
    const lookupType = view.getUint16(lookup);
    const subtableCount = view.getUint16(lookup + 4);
    const subtables: PairSubtable[] = [];
    for (let s = 0; s < subtableCount; s++) {
      let subtable = lookup + view.getUint16(lookup + 6 + s * 2);
      let type = lookupType;
      if (type === LOOKUP_EXTENSION) {
        type = view.getUint16(subtable + 2);
        subtable += view.getUint32(subtable + 4);
      }
      if (type !== LOOKUP_PAIR) continue;
      const pair = readPairPos(view, subtable);
      if (pair) subtables.push(pair);
    }
    if (subtables.length > 0) result.push(subtables);
  }
  return result;
}

function readPairPos(view: DataView, at: number): PairSubtable | undefined {
  const format = view.getUint16(at);
  const coverage = readCoverage(view, at + view.getUint16(at + 2));
  const valueFormat1 = view.getUint16(at + 4);
  const valueFormat2 = view.getUint16(at + 6);
  const size1 = valueRecordSize(valueFormat1);
  const size2 = valueRecordSize(valueFormat2);
  // XAdvance sits after XPlacement and YPlacement when those are present.
  const xAdvanceAt = valueFormat1 & VALUE_X_ADVANCE ? 2 * popCount(valueFormat1 & (VALUE_X_ADVANCE - 1)) : -1;

  if (format === 1) {
    const pairSetCount = view.getUint16(at + 8);
    const pairSets: Array<Map<number, number>> = [];
    for (let i = 0; i < pairSetCount; i++) {
      const set = at + view.getUint16(at + 10 + i * 2);
      const count = view.getUint16(set);
      const pairs = new Map<number, number>();
      for (let k = 0; k < count; k++) {
        const record = set + 2 + k * (2 + size1 + size2);
        const second = view.getUint16(record);
        // The first record for a second glyph counts; later duplicates are ignored as a shaper would.
        if (!pairs.has(second)) pairs.set(second, xAdvanceAt < 0 ? 0 : view.getInt16(record + 2 + xAdvanceAt));
      }
      pairSets.push(pairs);
    }
    return { format: 1, coverage, pairSets };
  }
  if (format === 2) {
    const classDef1 = readClassDef(view, at + view.getUint16(at + 8));
    const classDef2 = readClassDef(view, at + view.getUint16(at + 10));
    const class1Count = view.getUint16(at + 12);
    const class2Count = view.getUint16(at + 14);
    const xAdvance = new Int16Array(class1Count * class2Count);
    if (xAdvanceAt >= 0) {
      for (let c1 = 0; c1 < class1Count; c1++) {
        for (let c2 = 0; c2 < class2Count; c2++) {
          const record = at + 16 + (c1 * class2Count + c2) * (size1 + size2);
          xAdvance[c1 * class2Count + c2] = view.getInt16(record + xAdvanceAt);
        }
      }
    }
    return { format: 2, coverage, classDef1, classDef2, class1Count, class2Count, xAdvance };
  }
  return undefined;
}

/** Glyph index to coverage index (OpenType common formats, Coverage formats 1 and 2). */
function readCoverage(view: DataView, at: number): Map<number, number> {
  const format = view.getUint16(at);
  const count = view.getUint16(at + 2);
  const coverage = new Map<number, number>();
  if (format === 1) {
    for (let i = 0; i < count; i++) coverage.set(view.getUint16(at + 4 + i * 2), i);
  } else if (format === 2) {
    for (let i = 0; i < count; i++) {
      const record = at + 4 + i * 6;
      const start = view.getUint16(record);
      const end = view.getUint16(record + 2);
      const startIndex = view.getUint16(record + 4);
      for (let g = start; g <= end; g++) coverage.set(g, startIndex + g - start);
    }
  }
  return coverage;
}

/** Glyph index to class; glyphs not listed are class 0 (OpenType common formats, ClassDef 1 and 2). */
function readClassDef(view: DataView, at: number): Map<number, number> {
  const format = view.getUint16(at);
  const classes = new Map<number, number>();
  if (format === 1) {
    const start = view.getUint16(at + 2);
    const count = view.getUint16(at + 4);
    for (let i = 0; i < count; i++) classes.set(start + i, view.getUint16(at + 6 + i * 2));
  } else if (format === 2) {
    const count = view.getUint16(at + 2);
    for (let i = 0; i < count; i++) {
      const record = at + 4 + i * 6;
      const end = view.getUint16(record + 2);
      const value = view.getUint16(record + 4);
      for (let g = view.getUint16(record); g <= end; g++) classes.set(g, value);
    }
  }
  return classes;
}

function findTable(view: DataView, tag: string): number | undefined {
  const numTables = view.getUint16(4);
  for (let i = 0; i < numTables; i++) {
    const record = 12 + i * 16;
    if (readTag(view, record) === tag) return view.getUint32(record + 8);
  }
  return undefined;
}

function readTag(view: DataView, at: number): string {
  return String.fromCharCode(view.getUint8(at), view.getUint8(at + 1), view.getUint8(at + 2), view.getUint8(at + 3));
}

function valueRecordSize(valueFormat: number): number {
  return 2 * popCount(valueFormat & 0xff);
}

function popCount(bits: number): number {
  let count = 0;
  for (let b = bits; b; b &= b - 1) count++;
  return count;
}
