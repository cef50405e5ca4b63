// Slivers in repeat and stack charts: a remainder of a few per cent, cut by ink, is a 1-2 mm dash that does not
// read as the glyph. The cut stays (it is the honest share); the warning names the category and its share and
// offers a nearby readable unit at which no remainder is that small.
import type { ChartSpec } from '../document';
import type { Warning } from '../errors';
import { boxOf } from '../geometry/region';
import { sliverFindings, SLIVER_SHARE, type PartialGlyph } from '../integrity/preflight';
import type { SceneMark } from '../scene';
import { assertGlyphBudget, nextReadableUnits } from './chooseUnit';
import { formatValue } from './labels';
import { exactGlyphs, splitCount } from './resolveUnit';

/** A unit is offered only if it keeps every category to at most this many glyphs (a countable chart). */
const MOST_GLYPHS_OFFERED = 100;
const UNITS_TRIED_EACH_WAY = 6;

function sliverFree(values: readonly number[], unit: number): boolean {
  for (const v of values) {
    const { partial } = splitCount(exactGlyphs(v, unit));
    if (partial > 0 && partial < SLIVER_SHARE - 1e-9) return false;
    if (exactGlyphs(v, unit) > MOST_GLYPHS_OFFERED) return false;
  }
  try {
    assertGlyphBudget(values, unit);
  } catch {
    return false;
  }
  return true;
}

/** The readable unit nearest `unit` (alternating larger and smaller) at which no remainder is a sliver. */
export function unitWithoutSlivers(values: readonly number[], unit: number): number | null {
  const up = nextReadableUnits(unit, UNITS_TRIED_EACH_WAY, 'up');
  const down = nextReadableUnits(unit, UNITS_TRIED_EACH_WAY, 'down');
  for (let k = 0; k < UNITS_TRIED_EACH_WAY; k++) {
    for (const u of [up[k], down[k]]) if (u !== undefined && sliverFree(values, u)) return u;
  }
  return null;
}

/** Warnings (code 'sliver') for the partial glyphs of a repeat-per-category or stack chart. */
export function sliverWarnings(spec: ChartSpec, marks: readonly SceneMark[], unit: number): Warning[] {
  const partials: PartialGlyph[] = [];
  for (const m of marks) {
    for (const g of m.glyphs) {
      if (g.part !== 'partial') continue;
      const b = boxOf(g.region);
      partials.push({ owner: `"${m.label}"`, share: g.fraction, shortSideMm: Math.min(b.width, b.height) });
    }
  }
  const findings = sliverFindings(partials);
  if (findings.length === 0) return [];
  const better = unitWithoutSlivers(spec.data.map((r) => r.value), unit);
  const offer = better !== null ? ` A unit of ${formatValue(better)} per glyph avoids slivers.` : ' Another unit may avoid them.';
  return findings.map((f) => ({ code: 'sliver', message: f.message + offer }));
}
