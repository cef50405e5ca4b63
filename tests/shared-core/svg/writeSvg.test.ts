// writeSvg against docs/chart-svg.md, checked with tools that are not this project: xmllint validating
// against the W3C SVG 1.1 DTD (w3c-sgml-lib) together with the file's internal subset, xmllint's XPath for
// reading values back, and resvg rendering.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseChart, type ChartDocument } from '../../../shared-core/document';
import { TallyError } from '../../../shared-core/errors';
import { layoutChart } from '../../../shared-core/layout';
import type { Scene } from '../../../shared-core/scene';
import { writeSvg } from '../../../shared-core/svg';
import { verifySvg } from '../../../shared-core/integrity';
import { hasRsvg, hasXmllint, resvgAlphaSum, rsvgAlphaSum, xmllintValidateSvg11 } from '../../helpers/independent';

const PAGE = { width: 180, height: 120, unit: 'mm' } as const;

function chart(encoding: ChartDocument['encoding'], data: [string, number][], layout: ChartDocument['layout'] = {}): ChartDocument {
  return { format: 'tallyglyph.chart/1', title: 'Test chart', source: 'invented data', data: data.map(([label, value]) => ({ label, value })), encoding, layout, page: PAGE };
}

const MODES: [string, ChartDocument][] = [
  ['repeat', chart({ mode: 'repeat', glyph: 'bike', unit: 50, unitName: 'rides' }, [['Harbour Gate', 420], ['Mill Lane', 275], ['Old Market', 610], ['Station Square', 0]])],
  ['repeat shared grid', chart({ mode: 'repeat', glyph: 'person', unit: 1, arrangement: 'shared-grid' }, [['Bus', 31.5], ['Car', 28], ['Bike', 22.5], ['On foot', 18]])],
  ['stack', chart({ mode: 'stack', glyph: 'coffee', unit: 20, unitName: 'cups' }, [['Mon', 86], ['Tue', 94], ['Wed', 0], ['Sun', 131]])],
  ['scale', chart({ mode: 'scale', glyph: 'tree', unitName: 'trees' }, [['Northside', 340], ['Riverside', 1250], ['Eastfield', 0]])],
  ['fill', chart({ mode: 'fill', glyph: 'sprout', fillTo: 'share' }, [['Northside', 0.82], ['Riverside', 0], ['Eastfield', 1]])],
];

const scenes = new Map<string, Scene>(MODES.map(([name, doc]) => [name, layoutChart(parseChart(doc))]));
const sceneOf = (name: string) => scenes.get(name) as Scene;

function withFile<T>(svg: string, work: (file: string) => T): T {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-write-'));
  try {
    const file = path.join(dir, 'chart.svg');
    fs.writeFileSync(file, svg);
    return work(file);
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

/** An XPath string value read by xmllint, not by this project's parser. */
function xpath(svg: string, expr: string): string {
  return withFile(svg, (file) => {
    const r = spawnSync('xmllint', ['--nonet', '--xpath', expr, file], { encoding: 'utf8', timeout: 60_000 });
    if (r.status !== 0) throw new Error(`xmllint --xpath failed: ${r.stderr}`);
    // xmllint ends its output with one newline of its own.
    return r.stdout.replace(/\n$/, '');
  });
}

const svgRoot = "/*[local-name()='svg']";

describe.skipIf(!hasXmllint)('writeSvg output validates as SVG 1.1 (xmllint, W3C DTD)', () => {
  it('the validity check itself rejects an attribute the subset does not declare', () => {
    const svg = writeSvg(sceneOf('repeat')).replace('class="tg-mark"', 'class="tg-mark" data-undeclared="1"');
    const { valid, output } = xmllintValidateSvg11(svg);
    expect(valid).toBe(false);
    expect(output).toMatch(/data-undeclared/);
  });

  it.each(MODES.map(([name]) => name))('%s validates, with and without <use> references and as live text', (name) => {
    for (const opts of [{}, { useReferences: true }, { outlineText: false }]) {
      const { valid, output } = xmllintValidateSvg11(writeSvg(sceneOf(name), opts));
      expect(output).toBe('');
      expect(valid).toBe(true);
    }
  });
});

describe('writeSvg structure (docs/chart-svg.md)', () => {
  it.each(MODES.map(([name]) => name))('%s: outlined text, no scripts, no external references, no transforms', (name) => {
    for (const svg of [writeSvg(sceneOf(name)), writeSvg(sceneOf(name), { useReferences: true })]) {
      expect(svg).not.toMatch(/<text[\s>]/);
      expect(svg).not.toMatch(/<script|<foreignObject|<!ENTITY|<image/i);
      expect(svg).not.toMatch(/\btransform=/);
      const ids = new Set([...svg.matchAll(/\bid="([^"]+)"/g)].map((m) => m[1]));
      for (const m of svg.matchAll(/\bhref="([^"]*)"/g)) {
        expect(m[1].startsWith('#')).toBe(true);
        expect(ids.has(m[1].slice(1))).toBe(true);
      }
      expect(svg).toMatch(/class="tg-text" data-role="title" data-size-pt="[\d.]+"><path /);
    }
  });
});

describe.skipIf(!hasXmllint)('writeSvg values read back by xmllint', () => {
  it('gives the root its physical size with the bleed on every side and a matching viewBox', () => {
    const scene = layoutChart(parseChart(chart({ mode: 'repeat', glyph: 'bike', unit: 1 }, [['A', 3]], { bleedMm: 3 })));
    const svg = writeSvg(scene);
    // Trim 180 x 120 mm plus 3 mm each side; 1 user unit = 1 mm, trim box at 0 0.
    expect(xpath(svg, `string(${svgRoot}/@width)`)).toBe('186mm');
    expect(xpath(svg, `string(${svgRoot}/@height)`)).toBe('126mm');
    expect(xpath(svg, `string(${svgRoot}/@viewBox)`)).toBe('-3 -3 186 126');
    expect(xpath(svg, `string(${svgRoot}/@version)`)).toBe('1.1');
  });

  it('carries the summary JSON and each mark\'s data, escaped so any label reads back exactly', () => {
    const label = `Tom & Jerry's <"best"> café\tline`;
    const scene = layoutChart(parseChart(chart({ mode: 'repeat', glyph: 'bike', unit: 1 }, [[label, 2.5], ['Other', 0.1]])));
    const svg = writeSvg(scene);
    const summary = JSON.parse(xpath(svg, "string(//*[local-name()='metadata'][@id='tallyglyph-summary'])"));
    expect(summary).toEqual(scene.summary);
    expect(summary.data[0].label).toBe(label);
    expect(xpath(svg, "string(//*[@id='mark-1']/@data-label)")).toBe(label);
    expect(xpath(svg, "string(//*[@id='mark-2']/@data-value)")).toBe('0.1');
    expect(xpath(svg, "string(//*[@id='mark-1']/@data-reading)")).toBe('count');
    expect(xpath(svg, "count(//*[@id='mark-1']/*[@data-part='full'])")).toBe('2');
    expect(xpath(svg, "count(//*[@id='mark-1']/*[@data-part='partial'])")).toBe('1');
  });

  it('records stack slots and the shared baseline', () => {
    const scene = sceneOf('stack');
    const svg = writeSvg(scene);
    expect(Number(xpath(svg, "string(//*[@class='tg-marks']/@data-baseline-y)"))).toBeCloseTo(scene.summary.baselineYMm as number, 3);
    // Sun: 131 / 20 = 6.55 glyphs, slots 0..5 full and slot 6 partial.
    expect(xpath(svg, "string(//*[@id='mark-4']/*[last()]/@data-slot)")).toBe('6');
    expect(xpath(svg, "string(//*[@id='mark-4']/*[last()]/@data-part)")).toBe('partial');
    expect(xpath(svg, "count(//*[@class='tg-rule'][@data-role='baseline'])")).toBe('1');
  });

  it('writes legend keys with their glyph and unit value, and rest pieces in the pale colour', () => {
    const repeat = writeSvg(sceneOf('repeat'));
    expect(xpath(repeat, "string(//*[@class='tg-legend-key']/@data-unit-value)")).toBe('50');
    expect(xpath(repeat, "string(//*[@class='tg-legend-key']/@data-glyph)")).toBe('bike');
    const fill = sceneOf('fill');
    const svg = writeSvg(fill);
    expect(xpath(svg, "string(//*[@id='mark-1']/*[@data-part='rest']/@fill)")).toBe(fill.marks[0].restColor);
    expect(xpath(svg, "string(//*[@id='mark-1']/*[@data-part='filled']/@fill)")).toBe(fill.marks[0].color);
  });

  it('records the text size in points (1 pt = 25.4 / 72 mm, CSS Values and Units)', () => {
    const scene = sceneOf('repeat');
    const svg = writeSvg(scene);
    const title = scene.texts.find((t) => t.role === 'title');
    expect(Number(xpath(svg, "string(//*[@data-role='title']/@data-size-pt)"))).toBeCloseTo(((title?.sizeMm as number) * 72) / 25.4, 2);
  });
});

describe.skipIf(!hasXmllint)('writeSvg references in <defs>', () => {
  it('writes each repeated full glyph once in <defs> and places it with <use x y>', () => {
    const scene = sceneOf('repeat shared grid');
    const svg = writeSvg(scene, { useReferences: true });
    const fulls = scene.marks.flatMap((m) => m.glyphs).filter((g) => g.part === 'full').length;
    expect([...svg.matchAll(/<use /g)]).toHaveLength(fulls);
    expect(xpath(svg, "count(//*[local-name()='defs']/*[local-name()='path'])")).toBe('1');
    expect(svg).toMatch(/<use xlink:href="#glyph-person-1" x="[\d.]+" y="[\d.]+" fill="#[0-9a-f]{6}" data-part="full"\/>/);
  });
});

describe('writeSvg references', () => {
  it.each(MODES.map(([name]) => name))('%s renders the same with and without references (resvg, alpha summed)', (name) => {
    const scene = sceneOf(name);
    const plain = resvgAlphaSum(writeSvg(scene), 900);
    const referenced = resvgAlphaSum(writeSvg(scene, { useReferences: true }), 900);
    expect(plain).toBeGreaterThan(0);
    expect(Math.abs(referenced / plain - 1)).toBeLessThan(1e-4);
  });

  it.skipIf(!hasRsvg).each(MODES.map(([name]) => name))('%s renders the same with and without references (rsvg-convert, alpha summed)', (name) => {
    const scene = sceneOf(name);
    const plain = rsvgAlphaSum(writeSvg(scene), 900);
    const referenced = rsvgAlphaSum(writeSvg(scene, { useReferences: true }), 900);
    expect(plain).toBeGreaterThan(0);
    expect(Math.abs(referenced / plain - 1)).toBeLessThan(1e-4);
  });

  it.each(MODES.map(([name]) => name))('%s measures the same with and without references: every mark\'s ink and the lie factor to 1e-9', (name) => {
    // The same geometry written two ways (each copy in full, or one shape placed with <use>) must measure the same;
    // before copies were written as exact translates they differed by about 1e-5 of a glyph's ink.
    const scene = sceneOf(name);
    const plain = verifySvg(writeSvg(scene));
    const referenced = verifySvg(writeSvg(scene, { useReferences: true }));
    expect(referenced.marks.map((m) => m.id)).toEqual(plain.marks.map((m) => m.id));
    referenced.marks.forEach((m, i) => {
      expect(Math.abs(m.inkMm2 - plain.marks[i].inkMm2)).toBeLessThanOrEqual(1e-9 * Math.max(1, plain.marks[i].inkMm2));
      expect(Math.abs(m.graphic - plain.marks[i].graphic)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(plain.marks[i].graphic)));
    });
    expect(Math.abs((referenced.lieFactor.worst ?? 1) - (plain.lieFactor.worst ?? 1))).toBeLessThanOrEqual(1e-9);
    expect(referenced.pass).toBe(plain.pass);
  });

  it('writes every full copy of a glyph as an exact translate of one outline, in full or with <use>', () => {
    const scene = sceneOf('repeat');
    const plain = writeSvg(scene);
    const referenced = writeSvg(scene, { useReferences: true });
    // Copies written in full: every coordinate minus its copy's first point is the same list of whole micrometres.
    const fulls = [...plain.matchAll(/<path data-part="full" fill="#[0-9a-f]{6}" d="([^"]+)"/g)].map((m) => (m[1].match(/-?\d+(?:\.\d+)?/g) ?? []).map((n) => Math.round(Number(n) * 1000)));
    expect(fulls.length).toBeGreaterThan(10);
    const relative = fulls.map((c) => c.map((v, i) => v - c[i % 2]).join(' '));
    expect(new Set(relative).size).toBe(1);
    // With references: the <defs> outline moved by each <use x y> gives exactly the coordinates written in full.
    const defD = /<defs>\n<path id="[^"]+" d="([^"]+)"/.exec(referenced)?.[1] ?? '';
    const local = (defD.match(/-?\d+(?:\.\d+)?/g) ?? []).map((n) => Math.round(Number(n) * 1000));
    const offsets = [...referenced.matchAll(/<use [^>]*\bx="([^"]+)" y="([^"]+)"/g)].map((m) => [Math.round(Number(m[1]) * 1000), Math.round(Number(m[2]) * 1000)]);
    expect(offsets).toHaveLength(fulls.length);
    offsets.forEach(([dx, dy], k) => expect(local.map((v, i) => v + (i % 2 === 0 ? dx : dy))).toEqual(fulls[k]));
  });
});

describe('writeSvg numbers', () => {
  it('writes coordinates with at most the asked number of decimals', () => {
    const svg = writeSvg(sceneOf('scale'), { decimals: 2 });
    const numbers = [...svg.matchAll(/\bd="([^"]+)"/g)].flatMap((m) => m[1].match(/-?\d+(?:\.\d+)?/g) ?? []);
    expect(numbers.length).toBeGreaterThan(100);
    expect(numbers.filter((n) => /\.\d{3,}/.test(n))).toEqual([]);
    expect(() => writeSvg(sceneOf('scale'), { decimals: 7 })).toThrow(TallyError);
  });

  it('refuses a scene with a number that is not finite or a colour it cannot write', () => {
    const scene = sceneOf('repeat');
    const broken: Scene = { ...scene, marks: [{ ...scene.marks[0], value: Number.NaN }, ...scene.marks.slice(1)] };
    expect(() => writeSvg(broken)).toThrow(/not a finite number/);
    const badColour: Scene = { ...scene, marks: [{ ...scene.marks[0], color: 'red' }, ...scene.marks.slice(1)] };
    expect(() => writeSvg(badColour)).toThrow(/#rrggbb/);
  });
});
