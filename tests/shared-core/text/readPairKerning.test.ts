// A hand-built GPOS table exercising the lookup rules of the OpenType spec (GPOS chapter, "Lookup
// type 2: pair adjustment" and "Lookup type 9: extension"; byte layouts from memory). The reader's
// results on the real Noto Sans tables are checked against resvg in resvgAgreement.test.ts.
import { describe, expect, it } from 'vitest';
import { isTallyError } from '../../../shared-core/errors';
import { readPairKerning } from '../../../shared-core/text/readPairKerning';

class Writer {
  bytes: number[] = [];
  get at(): number {
    return this.bytes.length;
  }
  u16(...values: number[]): this {
    for (const v of values) this.bytes.push((v >> 8) & 0xff, v & 0xff);
    return this;
  }
  i16(v: number): this {
    return this.u16(v & 0xffff);
  }
  u32(v: number): this {
    return this.u16((v >>> 16) & 0xffff, v & 0xffff);
  }
  tag(t: string): this {
    for (const c of t) this.bytes.push(c.charCodeAt(0));
    return this;
  }
  /** Reserve an Offset16 field, filled in later relative to `base`. */
  offset16(): number {
    this.u16(0);
    return this.at - 2;
  }
  patch16(field: number, base: number): void {
    const v = this.at - base;
    this.bytes[field] = (v >> 8) & 0xff;
    this.bytes[field + 1] = v & 0xff;
  }
  patch32(field: number, base: number): void {
    const v = this.at - base;
    this.bytes.splice(field, 4, (v >>> 24) & 0xff, (v >> 16) & 0xff, (v >> 8) & 0xff, v & 0xff);
  }
}

/** GPOS with a 'kern' feature for 'latn': lookup 0 = Extension(PairPos 1, PairPos 2), lookup 1 = PairPos 1. */
function buildGpos(scriptTag = 'latn'): number[] {
  const w = new Writer();
  w.u16(1, 0);
  const scriptListField = w.offset16();
  const featureListField = w.offset16();
  const lookupListField = w.offset16();

  w.patch16(scriptListField, 0);
  const scriptList = w.at;
  w.u16(1).tag(scriptTag);
  const scriptField = w.offset16();
  w.patch16(scriptField, scriptList);
  const script = w.at;
  const langSysField = w.offset16();
  w.u16(0); // no language-specific systems
  w.patch16(langSysField, script);
  w.u16(0, 0xffff, 1, 0); // lookupOrder, no required feature, one feature: index 0

  w.patch16(featureListField, 0);
  const featureList = w.at;
  w.u16(1).tag('kern');
  const featureField = w.offset16();
  w.patch16(featureField, featureList);
  w.u16(0, 2, 1, 0); // no params, lookups listed out of order on purpose

  w.patch16(lookupListField, 0);
  const lookupList = w.at;
  w.u16(2);
  const lookupFields = [w.offset16(), w.offset16()];

  // Lookup 0: Extension wrapping a format 1 and a format 2 pair subtable.
  w.patch16(lookupFields[0], lookupList);
  const lookup0 = w.at;
  w.u16(9, 0, 2);
  const extensionFields = [w.offset16(), w.offset16()];
  const extensionTargets: number[] = [];
  for (const field of extensionFields) {
    w.patch16(field, lookup0);
    const extension = w.at;
    w.u16(1, 2);
    extensionTargets.push(w.at);
    w.u32(0);
    extensionTargets.push(extension);
  }

  // Extension 1 -> PairPos format 1: glyph 5 followed by 7 kerns -50.
  w.patch32(extensionTargets[0], extensionTargets[1]);
  const pair1 = w.at;
  w.u16(1);
  const coverage1Field = w.offset16();
  w.u16(0x0004, 0, 1);
  const pairSetField = w.offset16();
  w.patch16(coverage1Field, pair1);
  w.u16(1, 1, 5); // coverage format 1: [5]
  w.patch16(pairSetField, pair1);
  w.u16(1, 7).i16(-50);

  // Extension 2 -> PairPos format 2: first glyphs 5-6 (class 1); second glyphs 7-9 class 1, others class 0.
  w.patch32(extensionTargets[2], extensionTargets[3]);
  const pair2 = w.at;
  w.u16(2);
  const coverage2Field = w.offset16();
  w.u16(0x0004, 0);
  const classDef1Field = w.offset16();
  const classDef2Field = w.offset16();
  w.u16(2, 2);
  w.i16(0).i16(0); // class1 0 row
  w.i16(-5).i16(-30); // class1 1 row: unlisted second glyph -5, class 2 glyphs -30
  w.patch16(coverage2Field, pair2);
  w.u16(2, 1, 5, 6, 0); // coverage format 2: range 5-6 from index 0
  w.patch16(classDef1Field, pair2);
  w.u16(1, 5, 2, 1, 1); // classDef format 1: glyphs 5, 6 -> class 1
  w.patch16(classDef2Field, pair2);
  w.u16(2, 1, 7, 9, 1); // classDef format 2: range 7-9 -> class 1

  // Lookup 1: PairPos format 1 with XPlacement + XAdvance (XAdvance is the second field).
  w.patch16(lookupFields[1], lookupList);
  const lookup1 = w.at;
  w.u16(2, 0, 1);
  const subtableField = w.offset16();
  w.patch16(subtableField, lookup1);
  const pair3 = w.at;
  w.u16(1);
  const coverage3Field = w.offset16();
  w.u16(0x0005, 0, 1);
  const pairSet3Field = w.offset16();
  w.patch16(coverage3Field, pair3);
  w.u16(1, 1, 5);
  w.patch16(pairSet3Field, pair3);
  w.u16(1, 7).i16(99).i16(-20);
  return w.bytes;
}

function sfntWith(tag: string, table: number[]): Uint8Array {
  const w = new Writer();
  w.u32(0x00010000).u16(1, 16, 0, 0);
  w.tag(tag).u32(0).u32(28).u32(table.length);
  w.bytes.push(...table);
  return new Uint8Array(w.bytes);
}

describe('readPairKerning', () => {
  const kerning = readPairKerning(sfntWith('GPOS', buildGpos()));

  it('adds the values of separate lookups', () => {
    // Lookup 0's format 1 subtable gives -50, lookup 1 gives -20 (its XPlacement is not XAdvance).
    expect(kerning(5, 7)).toBe(-70);
  });

  it('inside a lookup, a format 1 miss falls through to the next subtable', () => {
    expect(kerning(5, 8)).toBe(-30);
    expect(kerning(6, 9)).toBe(-30);
  });

  it('format 2 applies class 0 to second glyphs it does not list', () => {
    expect(kerning(5, 20)).toBe(-5);
  });

  it('glyphs outside every coverage do not kern', () => {
    expect(kerning(4, 7)).toBe(0);
    expect(kerning(7, 5)).toBe(0);
  });

  it('falls back to DFLT when the script is absent, and kerns nothing without either', () => {
    expect(readPairKerning(sfntWith('GPOS', buildGpos('DFLT')))(5, 7)).toBe(-70);
    expect(readPairKerning(sfntWith('GPOS', buildGpos('cyrl')))(5, 7)).toBe(0);
  });

  it('a font without GPOS kerns nothing', () => {
    expect(readPairKerning(sfntWith('XXXX', buildGpos()))(5, 7)).toBe(0);
  });

  it('a truncated table is a plain data error, not a crash', () => {
    const bytes = sfntWith('GPOS', buildGpos());
    let error: unknown;
    try {
      readPairKerning(bytes.subarray(0, 80));
    } catch (e) {
      error = e;
    }
    expect(isTallyError(error) && error.code).toBe('data-invalid');
  });
});
