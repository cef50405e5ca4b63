// Labels never sit on data ink, legend keys or other labels: checked on every mode with demo-like data,
// measuring each text's ink afresh with the font outlines and each glyph piece's ink box from its polygons.
import { describe, expect, it } from 'vitest';
import { parseChart, type ChartDocument } from '../../../shared-core/document';
import { boxOf, type Box } from '../../../shared-core/geometry/region';
import { boxesOverlap, findLabelCollisions, layoutChart, resolveLabelCollisions } from '../../../shared-core/layout';
import type { Scene, SceneText } from '../../../shared-core/scene';
import { textOutline } from '../../../shared-core/text';

const PAGE = { width: 180, height: 120, unit: 'mm' } as const;
const SOURCE = 'invented demo data';

function chart(title: string, encoding: ChartDocument['encoding'], data: [string, number][], page: ChartDocument['page'] = PAGE): ChartDocument {
  return { format: 'tallyglyph.chart/1', title, source: SOURCE, data: data.map(([label, value]) => ({ label, value })), encoding, page };
}

const LONG: [string, number][] = [
  ['North Harbour Interchange and Ferry Terminal', 12],
  ['B', 3.5],
  ['Central Station West Entrance', 7],
  ['Old Market Square', 0],
];

const CHARTS: [string, ChartDocument][] = [
  ['repeat', chart('Rides in one week', { mode: 'repeat', glyph: 'bike', unit: 50, unitName: 'rides' }, [['Harbour Gate', 420], ['Mill Lane', 275], ['Old Market', 610], ['Station Square', 135]])],
  ['shared grid', chart('How 100 commuters travel', { mode: 'repeat', glyph: 'person', unit: 1, arrangement: 'shared-grid', unitName: 'commuters' }, [['Bus', 31], ['Car', 28], ['Bike', 23], ['On foot', 18]])],
  ['stack', chart('Cups sold, one week', { mode: 'stack', glyph: 'coffee', unit: 20, unitName: 'cups' }, [['Mon', 86], ['Tue', 94], ['Wed', 112], ['Thu', 105], ['Fri', 148], ['Sat', 173], ['Sun', 131]])],
  ['scale', chart('Trees planted, by district', { mode: 'scale', glyph: 'tree', unitName: 'trees' }, [['Northside', 340], ['Riverside', 1250], ['Hilltop', 610], ['Eastfield', 95]])],
  ['fill', chart('Share of the target reached', { mode: 'fill', glyph: 'sprout', fillTo: 'share' }, [['Northside', 0.82], ['Riverside', 0.47], ['Hilltop', 0.66], ['Eastfield', 0.23]])],
  ['repeat, long labels', chart('Long labels', { mode: 'repeat', glyph: 'bike', unit: 1 }, LONG, { width: 210, height: 148, unit: 'mm' })],
  ['stack, long labels', chart('Long labels', { mode: 'stack', glyph: 'coin', unit: 1 }, LONG, { width: 210, height: 148, unit: 'mm' })],
  ['scale, long labels', chart('Long labels', { mode: 'scale', glyph: 'tree' }, LONG, { width: 210, height: 148, unit: 'mm' })],
  ['fill, many categories', chart('Many', { mode: 'fill', glyph: 'drop' }, Array.from({ length: 16 }, (_, i): [string, number] => [`Area ${i + 1}`, (i * 7) % 11])) ],
];

/** The text's ink box measured here from its outline, not taken from the scene. */
function inkBox(t: SceneText): Box {
  return textOutline(t.text, { xMm: t.xMm, yMm: t.yMm, sizeMm: t.sizeMm, weight: t.weight, anchor: t.anchor }).bbox;
}

/** Plain interval test: the boxes share area (touching edges do not count). */
function intersects(a: Box, b: Box): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

function overlaps(scene: Scene): string[] {
  const out: string[] = [];
  const texts = scene.texts.filter((t) => t.text.trim() !== '').map((t) => ({ t, box: inkBox(t) }));
  // Each glyph piece's own ink box: a value label beside the last glyph of a wrapped row lies inside the whole
  // mark's box but clear of its ink.
  const marks = scene.marks.flatMap((m) => m.glyphs.map((g) => ({ id: m.id, box: boxOf(g.region) })));
  const keys = scene.legendKeys.map((k, i) => ({ id: `key ${i}`, box: boxOf(k.region) }));
  texts.forEach(({ t, box }, i) => {
    for (const o of [...marks, ...keys]) if (intersects(box, o.box)) out.push(`"${t.text}" on ${o.id}`);
    for (let j = i + 1; j < texts.length; j++) if (intersects(box, texts[j].box)) out.push(`"${t.text}" on "${texts[j].t.text}"`);
  });
  return out;
}

describe('layoutChart labels: no collisions', () => {
  it('the check itself sees a label moved onto a mark', () => {
    const scene = layoutChart(parseChart(CHARTS[0][1]));
    const label = scene.texts.find((t) => t.role === 'label') as SceneText;
    const b = boxOf(scene.marks[0].glyphs[0].region);
    const moved = { ...scene, texts: [{ ...label, xMm: b.x, yMm: b.y + b.height }] };
    // The label lies across one or more of the first mark's glyphs, and nothing else.
    const found = overlaps(moved);
    expect(found.length).toBeGreaterThan(0);
    for (const f of found) expect(f).toMatch(/ on mark-1$/);
  });

  it.each(CHARTS)('%s: no label box meets a mark, a legend key or another label', (_name, document) => {
    const scene = layoutChart(parseChart(document));
    expect(scene.texts.length).toBeGreaterThan(3);
    expect(overlaps(scene)).toEqual([]);
    expect(scene.warnings.filter((w) => w.code === 'label-overlap')).toEqual([]);
  });
});

describe('resolveLabelCollisions', () => {
  const scene = layoutChart(parseChart(CHARTS[0][1]));
  const mark = scene.marks[0];
  const markBox = boxOf(mark.glyphs.flatMap((g) => g.region));

  it('finds a label placed on a mark', () => {
    const onMark: SceneText = { role: 'note', text: 'on top', xMm: markBox.x + 1, yMm: markBox.y + markBox.height / 2, sizeMm: 3, weight: 400, anchor: 'start', color: '#000000' };
    const found = findLabelCollisions({ ...scene, texts: [onMark] });
    expect(found).toEqual([{ text: 0, with: 'mark', other: mark.id }]);
  });

  it('shrinks a label that only grazes a mark until it clears it', () => {
    // The baseline sits above the mark's top by the depth a "g" reaches at 3 mm: at 4 mm the descender
    // touches the mark, at 3 mm or less it clears it.
    const probe = textOutline('gag', { xMm: 0, yMm: 0, sizeMm: 1 }).bbox;
    const depthPerMm = probe.y + probe.height;
    const grazing: SceneText = { role: 'note', text: 'gag', xMm: markBox.x, yMm: markBox.y - 3 * depthPerMm, sizeMm: 4, weight: 400, anchor: 'start', color: '#000000' };
    expect(boxesOverlap(inkBox(grazing), markBox)).toBe(true);
    const { texts, warnings } = resolveLabelCollisions({ ...scene, texts: [grazing] });
    expect(texts[0].sizeMm).toBeLessThan(4);
    expect(boxesOverlap(inkBox(texts[0]), markBox)).toBe(false);
    expect(warnings).toEqual([]);
  });

  it('warns when even the smallest size cannot clear', () => {
    const buried: SceneText = { role: 'note', text: 'buried', xMm: markBox.x + 1, yMm: markBox.y + markBox.height / 2, sizeMm: 3, weight: 400, anchor: 'start', color: '#000000' };
    const { warnings } = resolveLabelCollisions({ ...scene, texts: [buried] });
    expect(warnings.map((w) => w.code)).toEqual(['label-overlap']);
  });
});
