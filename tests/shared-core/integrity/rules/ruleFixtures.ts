// Invented charts for the rule tests, laid out by the real pipeline, and small edits of a laid-out scene
// (a glyph made larger, a stack lifted) standing for a scene drawn by hand or by another tool.
import { parseChart, type ChartSpec } from '../../../../shared-core/document/index';
import type { Region } from '../../../../shared-core/geometry/index';
import type { IntegrityFinding } from '../../../../shared-core/integrity/check';
import type { ChartRule } from '../../../../shared-core/integrity/rules/index';
import { layoutChart } from '../../../../shared-core/layout/index';
import type { Scene } from '../../../../shared-core/scene/index';

export interface Laid {
  spec: ChartSpec;
  scene: Scene;
}

/** A chart document with sensible defaults: invented values, a stated unit and source. */
export function doc(over: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    format: 'tallyglyph.chart/1',
    title: 'Invented test chart',
    source: 'Invented test data',
    data: [
      { label: 'Alder Street', value: 30 },
      { label: 'Birch Road', value: 55 },
      { label: 'Cedar Lane', value: 40 },
    ],
    encoding: { mode: 'repeat', glyph: 'bike', unit: 5, unitName: 'bikes' },
    page: { width: 180, height: 120, unit: 'mm' },
    ...over,
  };
}

export function laid(over: Record<string, unknown> = {}): Laid {
  const spec = parseChart(doc(over));
  return { spec, scene: layoutChart(spec) };
}

export function run(rule: ChartRule, chart: Laid): IntegrityFinding[] {
  return rule.run(chart);
}

/** A deep copy of a scene, so tests can edit geometry without touching the original. */
export function copyScene(scene: Scene): Scene {
  return JSON.parse(JSON.stringify(scene)) as Scene;
}

/** Every point of a region moved by (dx, dy) mm. */
export function moved(region: Region, dx: number, dy: number): Region {
  return region.map((ring) => ring.map((p) => ({ x: p.x + dx, y: p.y + dy })));
}

/** A region scaled by s about its first point (area grows by s²). */
export function scaled(region: Region, s: number): Region {
  const o = region[0][0];
  return region.map((ring) => ring.map((p) => ({ x: o.x + (p.x - o.x) * s, y: o.y + (p.y - o.y) * s })));
}
