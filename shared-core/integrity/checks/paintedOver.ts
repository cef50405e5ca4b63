// Anything painted after a mark that lands on its ink hides part of it, so the reader sees less than is
// measured (common practice, no source).
import type { ChartSvgMark } from '../../svg/readChartSvg';
import { intersectRegions, regionArea, unionRegions, type Box, type Region } from '../../geometry/region';
import type { IntegrityFinding } from '../check';
import type { FileCheck, MarkInk, Owner } from '../measureFile';
import { blockingFinding, num } from './fileFinding';

/** What covered a mark, in words, by the kind of element it belongs to. */
const OVER_NAMES: Record<Owner['kind'], string> = {
  mark: 'another mark',
  legend: 'the key',
  text: 'text (a title, label or source line)',
  rule: 'a rule or baseline',
  background: 'a background',
  other: 'artwork',
};

function boxesMeet(a: Box, b: Box): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

/**
 * The part of a mark's ink that can meet `over`: the union of the pieces whose boxes meet its box. Pieces
 * whose boxes do not meet it share no area with it, so `over` meets this exactly where it meets the whole
 * mark, without building the whole mark's polygons (thousands of glyphs). Marks with loose shapes outside any
 * piece (not written by Tallyglyph) use their whole ink.
 */
function inkNear(mi: MarkInk, over: Box): Region {
  if (mi.other > 0) return mi.ink.region;
  const near: Region[] = [];
  for (const p of mi.pieces) if (p.ink.boxMm && boxesMeet(over, p.ink.boxMm)) near.push(p.ink.region);
  if (near.length <= 1) return near[0] ?? [];
  return unionRegions(near);
}

export const paintedOver: FileCheck = {
  code: 'painted-over',
  name: 'Mark painted over',
  severity: 'blocking',
  category: 'visibility',
  basis: 'common practice, no source',
  run(m) {
    const out: IntegrityFinding[] = [];
    const { shapes, owners } = m;
    const firstMarkAt = shapes.findIndex((sh) => owners.get(sh)?.kind === 'mark');
    if (firstMarkAt < 0) return out;
    const seen: MarkInk[] = [];
    const inkByMark = new Map(m.markInks.map((mi) => [mi.mark, mi] as const));
    const reported = new Set<ChartSvgMark>();
    const s = m.file.page.mmPerUnit;
    for (let i = firstMarkAt; i < shapes.length; i++) {
      const owner = owners.get(shapes[i]);
      if (owner?.kind === 'mark') {
        const mi = inkByMark.get(owner.mark);
        if (mi && !seen.includes(mi)) seen.push(mi);
        continue;
      }
      const over = m.roughInkOf([shapes[i]]);
      if (!over.boxMm) continue;
      for (const mi of seen) {
        if (reported.has(mi.mark) || !mi.ink.boxMm || !boxesMeet(over.boxMm, mi.ink.boxMm)) continue;
        const hidden = regionArea(intersectRegions(over.region, inkNear(mi, over.boxMm))) * s * s;
        if (hidden > 1e-6 * Math.max(mi.ink.areaMm2, 1e-9)) {
          reported.add(mi.mark);
          const what = OVER_NAMES[owner?.kind ?? 'other'];
          out.push(
            blockingFinding(
              'painted-over',
              `Something painted after "${mi.mark.label}" covers ${num(hidden)} mm² of its ink (${what}), so the reader sees less than is measured; nothing may be drawn over a mark.`,
              `Make room so that nothing overlaps "${mi.mark.label}": a larger page, a larger unit (fewer glyphs) or fewer rows, so the marks, labels, key and text each fit in their own place.`,
              mi.mark.label,
            ),
          );
        }
      }
    }
    return out;
  },
};
