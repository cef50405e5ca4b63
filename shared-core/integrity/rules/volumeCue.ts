// A glyph drawn as a solid (a box with a top and a side, a barrel with an elliptical cap) invites readers to
// judge its volume; scaled by area, its apparent volume grows with the value to the power 1.5.
import { solidCuesOf } from '../../audit/solidCues';
import type { GlyphRef } from '../../document/index';
import { collectShapes, getGlyph } from '../../glyph/index';
import { parseXml } from '../../svg/index';
import { findingOf, type ChartRule } from './ruleInput';

function svgOf(ref: GlyphRef): { name: string; svg: string } | null {
  if (typeof ref !== 'string') return { name: 'inline glyph', svg: ref.svg };
  try {
    const entry = getGlyph(ref);
    return { name: entry.name, svg: entry.svg };
  } catch {
    // An unknown name fails layout with its own message; nothing to judge here.
    return null;
  }
}

export const volumeCue: ChartRule = {
  code: 'volume-cue',
  name: 'Solid-looking glyph scaled by area',
  severity: 'warning',
  run({ spec }) {
    if (spec.encoding.mode !== 'scale') return [];
    const refs = [spec.encoding.glyph, ...spec.data.map((r) => r.glyph).filter((g): g is GlyphRef => g !== undefined)];
    const seen = new Set<string>();
    const out = [];
    for (const ref of refs) {
      const glyph = svgOf(ref);
      if (!glyph || seen.has(glyph.svg)) continue;
      seen.add(glyph.svg);
      const cues = solidCuesOf(collectShapes(parseXml(glyph.svg)).shapes);
      if (cues.length === 0) continue;
      const users = spec.data.filter((r) => (r.glyph ?? spec.encoding.glyph) === ref).map((r) => r.label);
      out.push(
        findingOf(this, {
          message: `The ${glyph.name === 'inline glyph' ? 'inline glyph' : `glyph "${glyph.name}"`} looks like a solid object (${cues.join(', ').replace(/-/g, ' ')}); scaled by area, readers may judge its volume and overrate the larger values.`,
          fix: 'Use a flat glyph (one face, no perspective or shading), or switch to repeat mode so the number of glyphs carries the value.',
          ...(users.length ? { category: users[0] } : {}),
          basis: 'Tufte 1983, p. 71: barrels read by volume give a lie factor of 59.4',
          action: { kind: 'set-mode', label: 'Use repeat mode', payload: { mode: 'repeat' } },
        }),
      );
    }
    return out;
  },
};
