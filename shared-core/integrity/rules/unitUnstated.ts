// A unit chart that does not say what one glyph stands for cannot be read: 12 glyphs of what?
import { findingOf, type ChartRule } from './ruleInput';

export const unitUnstated: ChartRule = {
  code: 'unit-unstated',
  name: 'Unit not stated',
  severity: 'warning',
  run({ spec, scene }) {
    const shares = spec.encoding.mode === 'fill' && spec.encoding.fillTo === 'share';
    const legendShown = scene.legendKeys.length > 0 || scene.texts.some((t) => t.role === 'legend');
    if (!legendShown && scene.marks.some((m) => m.value > 0)) {
      return [
        findingOf(this, {
          message: spec.encoding.mode === 'scale' ? 'The chart has no key saying what amount a glyph\'s size stands for.' : 'The chart does not say what one glyph stands for (the legend is off).',
          fix: 'Turn the legend on, so the chart says "one glyph = N ...".',
          basis: 'Isotype practice: each symbol stands for a fixed, stated quantity (Neurath, secondary sources)',
          action: { kind: 'show-legend', label: 'Show the legend' },
        }),
      ];
    }
    if (!shares && !(spec.encoding.unitName ?? '').trim()) {
      return [
        findingOf(this, {
          message: `The chart says how many units a glyph stands for (${scene.summary.mode === 'scale' ? 'its legend values' : `${scene.summary.unit}`}) but not of what: the unit has no name.`,
          fix: 'Name what is counted (for example "rides" or "tonnes of CO2"), so the legend reads "one glyph = 50 rides".',
          basis: 'Isotype practice: each symbol stands for a fixed, stated quantity (Neurath, secondary sources)',
          action: { kind: 'set-unit-name', label: 'Name the unit' },
        }),
      ];
    }
    return [];
  },
};
