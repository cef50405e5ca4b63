// The bundled glyph catalog: stored ink figures against an independent rasteriser and a fresh
// measurement, the index's integrity against the npm package it comes from, and name lookup.
import { Resvg } from '@resvg/resvg-js';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import {
  FRACTION_DECIMALS,
  UNIT_DECIMALS,
  glyphCategories,
  glyphChoices,
  glyphIndexPath,
  iconPackageDir,
  licenceCopyPath,
  minimalSvg,
  roundTo,
  type GlyphIndexFile,
} from '../../../scripts/build-glyph-index';
import { isTallyError } from '../../../shared-core/errors';
import { GLYPH_CATEGORIES, GLYPH_SET_INFO, editDistance, findGlyphs, getGlyph, listGlyphs } from '../../../shared-core/glyph/catalog';
import { measureGlyph } from '../../../shared-core/glyph';
import { parseXml, walkElements } from '../../../shared-core/svg';

const committedText = readFileSync(glyphIndexPath, 'utf8');
const committed = JSON.parse(committedText) as GlyphIndexFile;
const glyphs = listGlyphs();

const RENDER_WIDTH_PX = 2048;

describe('bundled glyphs against resvg', () => {
  // Independent check: resvg rasterises each stored SVG with its own path and anti-aliasing code.
  // The premultiplied alpha of a pixel is its covered fraction, so the alpha sum over the image is
  // the ink area in pixels (TOOLCHAIN.md: alpha sums track filled area within 0.02%; the 0.1% bound
  // leaves room for edge anti-aliasing on thin strokes).
  let worst = { name: '', relative: 0 };
  afterAll(() => {
    console.info(`resvg ${RENDER_WIDTH_PX} px vs stored inkArea: worst ${(worst.relative * 100).toFixed(4)}% (${worst.name}) over ${glyphs.length} glyphs`);
  });

  for (const glyph of glyphs) {
    it(`${glyph.name}: ink area and ink box agree with a ${RENDER_WIDTH_PX} px raster`, () => {
      const image = new Resvg(glyph.svg, { fitTo: { mode: 'width', value: RENDER_WIDTH_PX } }).render();
      const pixels = image.pixels; // every access copies the buffer: read once
      const { width, height } = image;
      expect(width).toBe(RENDER_WIDTH_PX);
      const unitsPerPx = glyph.viewBox.width / width;
      expect(height).toBe(Math.round(glyph.viewBox.height / unitsPerPx));

      let alphaSum = 0;
      let minX = width, minY = height, maxX = -1, maxY = -1;
      for (let y = 0; y < height; y++) {
        const row = y * width * 4;
        for (let x = 0; x < width; x++) {
          const a = pixels[row + x * 4 + 3];
          if (a === 0) continue;
          alphaSum += a;
          if (x < minX) minX = x;
          if (x > maxX) maxX = x;
          if (y < minY) minY = y;
          if (y > maxY) maxY = y;
        }
      }
      const rasterAreaUnits2 = (alphaSum / 255) * unitsPerPx ** 2;
      const relative = (rasterAreaUnits2 - glyph.inkAreaUnits2) / glyph.inkAreaUnits2;
      if (Math.abs(relative) > Math.abs(worst.relative) || worst.name === '') worst = { name: glyph.name, relative };
      expect(Math.abs(relative)).toBeLessThan(0.001);

      // Touched pixels bound the ink: each box edge lies within the first or last touched pixel
      // (1.5 px allowed for anti-aliasing spill at pixel boundaries).
      const slack = 1.5 * unitsPerPx;
      const box = glyph.bbox;
      expect(Math.abs(box.x - minX * unitsPerPx)).toBeLessThan(slack);
      expect(Math.abs(box.y - minY * unitsPerPx)).toBeLessThan(slack);
      expect(Math.abs(box.x + box.width - (maxX + 1) * unitsPerPx)).toBeLessThan(slack);
      expect(Math.abs(box.y + box.height - (maxY + 1) * unitsPerPx)).toBeLessThan(slack);
    });
  }
});

describe('glyph index integrity', () => {
  const packageDir = iconPackageDir();
  const upstreamPackage = JSON.parse(readFileSync(join(packageDir, 'package.json'), 'utf8')) as { version: string; license: string };

  it('bundles at least 60 glyphs with unique short lower-case names, sorted', () => {
    expect(glyphs.length).toBeGreaterThanOrEqual(60);
    const names = glyphs.map((g) => g.name);
    expect(new Set(names).size).toBe(names.length);
    expect([...names].sort()).toEqual(names);
    for (const name of names) expect(name).toMatch(/^[a-z][a-z0-9]*(-[a-z0-9]+)*$/);
    for (const g of glyphs) {
      expect(g.tags.length).toBeGreaterThanOrEqual(2);
      expect(g.tags.length).toBeLessThanOrEqual(5);
    }
  });

  it('covers every category infographics commonly need (project brief)', () => {
    const present = new Set(glyphs.map((g) => g.category));
    for (const c of ['people', 'animals', 'transport', 'buildings', 'food', 'nature', 'money', 'devices', 'health', 'shapes']) {
      expect(present, c).toContain(c);
    }
    expect([...glyphCategories]).toEqual([...GLYPH_CATEGORIES]);
  });

  it('carries the upstream MIT licence text and the package version (from the npm package itself)', () => {
    expect(existsSync(licenceCopyPath)).toBe(true);
    const licence = readFileSync(licenceCopyPath, 'utf8');
    expect(licence).toBe(readFileSync(join(packageDir, 'LICENSE'), 'utf8'));
    expect(licence).toMatch(/^MIT License/);
    expect(upstreamPackage.license).toBe('MIT');
    expect(GLYPH_SET_INFO.licence).toBe('MIT');
    expect(GLYPH_SET_INFO.licenceFile).toBe('LICENSE-phosphor.txt');
    expect(GLYPH_SET_INFO.version).toBe(upstreamPackage.version);
    expect(GLYPH_SET_INFO.glyphCount).toBe(glyphs.length);
  });

  it('stores each upstream icon as the minimal markup the build script derives today', () => {
    // Guards against a stale index after the npm package changes: same choices, same markup.
    expect(committed.glyphs.map((g) => g.source).sort()).toEqual(glyphChoices.map((c) => c.source).sort());
    for (const choice of glyphChoices) {
      const entry = getGlyph(choice.name);
      expect(entry.source).toBe(choice.source);
      expect(entry.category).toBe(choice.category);
      expect([...entry.tags]).toEqual(choice.tags);
      const upstream = readFileSync(join(packageDir, 'assets', 'fill', choice.source), 'utf8');
      expect(entry.svg).toBe(minimalSvg(upstream, choice.source));
    }
    expect(committedText).toBe(JSON.stringify(committed, null, 2) + '\n');
  });

  it('keeps only a root <svg> and paths, with the viewBox the entry states (SVG 1.1 §7.7 viewBox)', () => {
    for (const g of glyphs) {
      const root = parseXml(g.svg);
      const names = [...walkElements(root)].map((el) => el.qname);
      expect(names[0]).toBe('svg');
      expect(new Set(names.slice(1))).toEqual(new Set(['path']));
      const vb = g.viewBox;
      expect(root.attrs.viewBox).toBe(`${vb.x} ${vb.y} ${vb.width} ${vb.height}`);
    }
  });

  it('stores ink figures equal to a fresh measureGlyph of the stored svg, without warnings', () => {
    for (const g of glyphs) {
      const ink = measureGlyph(g.svg);
      expect(ink.warnings, g.name).toEqual([]);
      expect(g.inkAreaUnits2, g.name).toBe(roundTo(ink.areaUnits2, UNIT_DECIMALS));
      expect(g.bbox.x).toBe(roundTo(ink.bbox.x, UNIT_DECIMALS));
      expect(g.bbox.y).toBe(roundTo(ink.bbox.y, UNIT_DECIMALS));
      expect(g.bbox.width).toBe(roundTo(ink.bbox.width, UNIT_DECIMALS));
      expect(g.bbox.height).toBe(roundTo(ink.bbox.height, UNIT_DECIMALS));
      expect(g.boxFraction).toBe(roundTo(ink.boxFraction, FRACTION_DECIMALS));
    }
  });

  const pathData = (svg: string) => [...walkElements(parseXml(svg))].filter((el) => el.name === 'path').map((el) => el.attrs.d);

  it('measures the circle glyph as its two arcs enclose (circular segment area r²/2·(φ − sin φ))', () => {
    // Upstream draws 3/4 of a circle of radius 104 about (128,128), then closes the last quarter with
    // a slightly flatter arc of radius 104.13 over the same chord (SVG 1.1 F.6: radii that are large
    // enough are used as given). Exact area: disc − segment(r = 104) + segment(r = 104.13).
    const circle = getGlyph('circle');
    expect(pathData(circle.svg)).toEqual(['M232,128A104,104,0,1,1,128,24,104.13,104.13,0,0,1,232,128Z']);
    const chord = Math.hypot(232 - 128, 128 - 24);
    const segment = (r: number) => {
      const phi = 2 * Math.asin(chord / 2 / r);
      return (r * r / 2) * (phi - Math.sin(phi));
    };
    const exact = Math.PI * 104 ** 2 - segment(104) + segment(104.13);
    // Flattening at 1e-5 of the extent loses about (2/3)·sagitta·perimeter ≈ 3e-5 of the area.
    expect(Math.abs(circle.inkAreaUnits2 / exact - 1)).toBeLessThan(1e-4);
    for (const [got, want] of [[circle.bbox.x, 24], [circle.bbox.y, 24], [circle.bbox.width, 208], [circle.bbox.height, 208]]) {
      expect(Math.abs(got - want)).toBeLessThan(0.01);
    }
  });

  it('measures the square glyph as a rounded rectangle (area w·h − (4 − π)·r²)', () => {
    const square = getGlyph('square');
    expect(pathData(square.svg)).toEqual(['M224,48V208a16,16,0,0,1-16,16H48a16,16,0,0,1-16-16V48A16,16,0,0,1,48,32H208A16,16,0,0,1,224,48Z']);
    const exact = 192 * 192 - (4 - Math.PI) * 16 ** 2;
    expect(Math.abs(square.inkAreaUnits2 / exact - 1)).toBeLessThan(1e-4);
  });
});

describe('getGlyph', () => {
  const thrown = (name: string) => {
    try {
      getGlyph(name);
    } catch (e) {
      return e;
    }
    throw new Error(`getGlyph(${JSON.stringify(name)}) did not throw`);
  };
  const suggestionsOf = (e: unknown) => (isTallyError(e) ? (e.details as { suggestions: string[] }).suggestions : []);

  it('finds a glyph by name, ignoring case and surrounding spaces', () => {
    expect(getGlyph('bike').source).toBe('bicycle-fill.svg');
    expect(getGlyph('  Bike ')).toBe(getGlyph('bike'));
  });

  it("throws glyph-unknown for 'nope', listing up to 8 real names in the message", () => {
    const e = thrown('nope');
    expect(isTallyError(e) && e.code).toBe('glyph-unknown');
    const suggestions = suggestionsOf(e);
    expect(suggestions.length).toBeGreaterThan(0);
    expect(suggestions.length).toBeLessThanOrEqual(8);
    const message = (e as Error).message;
    expect(message).toContain('"nope"');
    for (const s of suggestions) {
      expect(message).toContain(s);
      expect(getGlyph(s).name).toBe(s);
    }
  });

  it('puts the obvious name first for a misspelling, a truncation and an upstream name used as a tag', () => {
    expect(suggestionsOf(thrown('peson'))[0]).toBe('person');
    expect(suggestionsOf(thrown('hous'))[0]).toBe('house');
    expect(suggestionsOf(thrown('bicycle'))[0]).toBe('bike');
    expect(suggestionsOf(thrown('airplane'))[0]).toBe('plane');
  });

  it('keeps a very long unknown name out of the message', () => {
    const e = thrown('x'.repeat(5000));
    expect((e as Error).message.length).toBeLessThan(400);
  });
});

describe('findGlyphs and listGlyphs', () => {
  it('ranks the exact name first and matches tags and categories', () => {
    expect(findGlyphs('car')[0].name).toBe('car');
    const school = findGlyphs('school').map((g) => g.name);
    expect(school).toEqual(expect.arrayContaining(['graduation', 'student']));
    const transport = findGlyphs('transport');
    expect(transport.map((g) => g.name).sort()).toEqual(glyphs.filter((g) => g.category === 'transport').map((g) => g.name).sort());
  });

  it('needs every word of the query to match', () => {
    expect(findGlyphs('farm animal').map((g) => g.name).sort()).toEqual(['cow', 'horse']);
    expect(findGlyphs('zzqx')).toEqual([]);
  });

  it('gives every glyph for a blank query', () => {
    expect(findGlyphs('  ').length).toBe(glyphs.length);
  });

  it('hands out entries that callers cannot change', () => {
    const list = listGlyphs();
    list.pop();
    expect(listGlyphs().length).toBe(glyphs.length);
    expect(Object.isFrozen(list[0])).toBe(true);
    expect(Object.isFrozen(list[0].tags)).toBe(true);
  });

  it('measures edit distance as Levenshtein: kitten to sitting is 3 (substitute k, substitute e, insert g)', () => {
    expect(editDistance('kitten', 'sitting')).toBe(3);
    expect(editDistance('', 'abc')).toBe(3);
    expect(editDistance('flaw', 'lawn')).toBe(2);
  });
});
