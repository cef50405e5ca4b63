// Preflight: content inside the page but closer to the trim than the safe margin; trimming can be off by a
// millimetre or two (printers' common practice, no source). Content beyond the page is its own finding.
import { reachesPastPage } from './contentOutsidePage';
import { EDGE_SLACK_MM, mm, preflightCheck, preflightFinding } from './preflightShared';

export const contentOutsideSafeArea = preflightCheck({
  code: 'content-outside-safe-area',
  name: 'Content in the trim margin',
  fix: () => 'Widen the page margins to at least the safe margin, so labels and marks keep clear of the trim edge.',
  findIn(input) {
    if (reachesPastPage(input)) return [];
    const box = input.contentBoxMm;
    const { widthMm, heightMm } = input.page;
    const safeMm = input.safeMarginMm;
    const outsideSafe =
      box.x < safeMm - EDGE_SLACK_MM ||
      box.y < safeMm - EDGE_SLACK_MM ||
      box.x + box.width > widthMm - safeMm + EDGE_SLACK_MM ||
      box.y + box.height > heightMm - safeMm + EDGE_SLACK_MM;
    if (!outsideSafe) return [];
    return [
      preflightFinding(
        'content-outside-safe-area',
        `Content comes closer than ${mm(safeMm)} mm to the trim edge; trimming can be off by a millimetre or two, so keep labels and marks inside the safe area (common practice).`,
      ),
    ];
  },
});
