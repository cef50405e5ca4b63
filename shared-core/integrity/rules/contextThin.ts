// Two periods alone show a change but not whether it is a trend, a blip or a return to normal.
import { findingOf, periodsOf, type ChartRule } from './ruleInput';

export const contextThin: ChartRule = {
  code: 'context-thin',
  name: 'Only two periods',
  severity: 'advice',
  run({ spec }) {
    const periods = periodsOf(spec);
    if (!periods || periods.length !== 2) return [];
    return [
      findingOf(this, {
        message: `Only two periods are shown (${periods[0].text} and ${periods[1].text}): readers cannot tell whether the change is a trend, a one-off or a return to an earlier level.`,
        fix: `Add a few earlier periods before ${periods[0].text}, or dismiss this advice with the reason a two-point comparison is what the brief needs.`,
        basis: 'Tufte 1983, ch. 2: graphics must not quote data out of context (from memory)',
      }),
    ];
  },
};
