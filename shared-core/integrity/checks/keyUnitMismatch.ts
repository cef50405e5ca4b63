// The lie factor compares categories with each other; the key makes an absolute claim too ("one glyph = 50
// rides"). A chart drawn at twice the stated unit throughout has lie factor 1 but still misleads, so each mark
// is held to the key within the same band as the lie factor (Tufte 1983, p. 57).
import type { FileCheck } from '../measureFile';
import { blockingFinding, num, relDiff } from './fileFinding';
import { ISOTYPE_BASIS } from './glyphSizeVaries';

export const keyUnitMismatch: FileCheck = {
  code: 'key-unit-mismatch',
  name: 'Drawn at another unit than the key states',
  severity: 'blocking',
  category: 'consistency',
  basis: ISOTYPE_BASIS,
  run(m) {
    const summary = m.file.summary;
    const reading = m.reading;
    const tolerance = m.limits.high - 1;
    const keyUnit = m.file.legendKeys.find((k) => k.unitValue !== null)?.unitValue ?? null;
    const unit = reading === 'count' || reading === 'length' ? (keyUnit ?? summary?.unit ?? null) : (summary?.unit ?? null);
    if (!(unit !== null && unit > 0 && Number.isFinite(unit))) return [];
    const unitName = summary?.unitName ? ` ${summary.unitName}` : '';
    // The first mark off the key is reported: the fix (state the unit drawn) is the same for all.
    for (const mk of m.marks) {
      if (!(mk.value > 0)) continue;
      if ((reading === 'count' || reading === 'length') && mk.glyphs !== undefined && mk.unitInkMm2 !== undefined) {
        const shown = mk.glyphs * unit;
        if (relDiff(shown, mk.value) > tolerance + 1e-9) {
          return [
            blockingFinding(
              'key-unit-mismatch',
              `"${mk.label}" is drawn as ${num(mk.glyphs)} glyphs, which the key reads as ${num(shown)}${unitName} at ${num(unit)} per glyph, but its value is ${num(mk.value)}.`,
              `Make the key state the amount one glyph is drawn for, or draw "${mk.label}" at the key's ${num(unit)} per glyph.`,
              mk.label,
            ),
          ];
        }
      } else if (reading === 'fill' && mk.fillShare !== undefined) {
        const expected = mk.value / unit;
        if (relDiff(mk.fillShare, expected) > tolerance + 1e-9) {
          return [
            blockingFinding(
              'key-unit-mismatch',
              `"${mk.label}" is filled to ${num(mk.fillShare * 100)}% of its glyph's ink, but its value ${num(mk.value)} of ${num(unit)} is ${num(expected * 100)}%.`,
              `Fill "${mk.label}" to ${num(expected * 100)}% of its glyph's ink, or state the whole it is a share of.`,
              mk.label,
            ),
          ];
        }
      } else if (reading === 'area') {
        const shown = mk.inkMm2 * unit;
        if (relDiff(shown, mk.value) > tolerance + 1e-9) {
          return [
            blockingFinding(
              'key-unit-mismatch',
              `"${mk.label}" carries ${num(mk.inkMm2)} mm² of ink, which the file's scale (${num(unit)} per mm²) reads as ${num(shown)}, but its value is ${num(mk.value)}.`,
              `Scale "${mk.label}" to the chart's stated ink per unit of value, or state the scale it is drawn at.`,
              mk.label,
            ),
          ];
        }
      }
    }
    return [];
  },
};
