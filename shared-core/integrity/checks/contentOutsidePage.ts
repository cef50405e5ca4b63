// Preflight: content that reaches past the trim edge is cut off when the sheet is trimmed.
import type { PreflightInput } from '../preflight';
import { EDGE_SLACK_MM, mm, preflightCheck, preflightFinding } from './preflightShared';

/** Whether the content box reaches past any trim edge (a nanometre of float noise allowed). */
export function reachesPastPage(input: PreflightInput): boolean {
  const box = input.contentBoxMm;
  const { widthMm, heightMm } = input.page;
  return box.x < -EDGE_SLACK_MM || box.y < -EDGE_SLACK_MM || box.x + box.width > widthMm + EDGE_SLACK_MM || box.y + box.height > heightMm + EDGE_SLACK_MM;
}

export const contentOutsidePage = preflightCheck({
  code: 'content-outside-page',
  name: 'Content beyond the page',
  fix: () => 'Make the page larger or the margins wider, so everything lies inside the trim edge.',
  findIn(input) {
    if (!reachesPastPage(input)) return [];
    const box = input.contentBoxMm;
    const { widthMm, heightMm } = input.page;
    return [
      preflightFinding(
        'content-outside-page',
        `Content reaches beyond the page (content ${mm(box.x)}–${mm(box.x + box.width)} x ${mm(box.y)}–${mm(box.y + box.height)} mm on a ${mm(widthMm)} x ${mm(heightMm)} mm page); whatever lies outside is cut off when trimmed.`,
      ),
    ];
  },
});
