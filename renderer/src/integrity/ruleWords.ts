// The chart rules' sentences in the app's words: the rules speak of "the legend" and "repeat mode" as the
// document does, the window calls them the Key (Show: Key) and the Repeat mode. Built on findingWords.
import { toUiWords } from '../honesty/findingWords';

const RULE_WORDS: ReadonlyArray<readonly [RegExp, string]> = [
  [/Turn the legend on/g, 'Turn the key on (Show: Key)'],
  [/Show the legend/g, 'Show the key'],
  [/the legend is off/g, 'the key is off'],
  [/\blegend\b/g, 'key'],
  [/\bLegend\b/g, 'Key'],
  [/\b(switch to|Use) (repeat|stack|scale|fill) mode\b/g, '$1 the $2 mode'],
];

/** A rule's message, fix or button label as the designer should read it. */
export function ruleWords(sentence: string): string {
  let out = sentence;
  for (const [pattern, words] of RULE_WORDS) out = out.replace(pattern, words);
  return toUiWords(out);
}
