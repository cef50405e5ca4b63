// Preflight: a bleed asked for that nothing reaches into, so the trimmed edge may show a white line.
import { mm, preflightCheck, preflightFinding } from './preflightShared';

export const bleedUnused = preflightCheck({
  code: 'bleed-unused',
  name: 'Bleed left empty',
  fix: () => 'Extend the background to the bleed edge, or set the bleed to 0.',
  findIn(input) {
    if (!(input.bleedMm > 0) || input.backgroundCoversBleed) return [];
    return [
      preflightFinding(
        'bleed-unused',
        `A ${mm(input.bleedMm)} mm bleed was asked for but nothing reaches into it; extend the background to the bleed edge, or drop the bleed.`,
      ),
    ];
  },
});
