// Speed work on layout, the writer and embedding must not change a single byte of what is written. The
// hashes were taken from the code before that work (commit b208529); a deliberate change to the output of
// these charts (new layout defaults, a writer change) must come with new hashes, from `sha256sum` of the
// files the old and the new code write, never copied from a failing run without looking at the difference.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { parseChart } from '../../../shared-core/document/index';
import { layoutChart, withGlyphBudget } from '../../../shared-core/layout/index';
import { renderChart } from '../../../shared-core/pipeline/index';
import { writeSvg } from '../../../shared-core/svg/index';
import { SAME_BYTES_CASES } from './sameBytesCases';

const SHA256_BEFORE: Record<string, string> = {
  'demo repeat-bike-share': 'e7c6227b9d65b1d3a9bd6c0c62b237c52c246b4dbe920e0f2f2c88b3192e0ddb',
  'demo repeat-bike-share with references': 'aa64cbc79b9446fc19d3b4b721348e12410d36d0d32319e2721c6af6ca064f65',
  'demo stack-cafe-cups': '09fbce20ac62db1671d583588dbf482106f9ba5f173a950840ce24e8e8121868',
  'demo stack-cafe-cups with references': '989465dbade52d2403d5fcc0ea304ff7fc5ee953efbc3beb6ab01d802c49f4d9',
  'demo scale-trees-planted': '864487b8a976a4e316557bdeee98fc32231cbd651133cc18904c38c823b1c1e8',
  'demo scale-trees-planted with references': '864487b8a976a4e316557bdeee98fc32231cbd651133cc18904c38c823b1c1e8',
  'demo fill-planting-target': '45dee8a96663391b21a350f8cb632c89ac41570441d6580a6548f5b2afd3b879',
  'demo fill-planting-target with references': '45dee8a96663391b21a350f8cb632c89ac41570441d6580a6548f5b2afd3b879',
  'demo icon-array-commute': '2a38e906712749e4f144d19cc5877644b65df0e69d56f195128af7e9905d38f9',
  'demo icon-array-commute with references': '36041c61b104ccf85828088bea9d2aede1af301aa36a4b6ef32b2313b78aaee8',
  'demo repeat-library-per-resident': 'c1fc31198e1f4aeb3834ad58544bd5c0471e611ee74a6f04b293b70b85bef132',
  'demo repeat-library-per-resident with references': 'ad8c728f74967bbd582baee5f893b5184e87b4affddde0390761163688a7a379',
  'repeat 1,000 with references': '2f380d5ba02d39ff9f0c246a3b626ae27f2dc4b531d66ce99daa12accf1bdecb',
  'repeat 1,000 without references': '38fc9281422fc75f17cb1341bd5736a750bec7f6bc03105b312b00619c2ec05e',
  'repeat 1,000 shared grid': '795782c9263ea578cbd1b012dfe4827c7bf70060baa0ae4828ed45d583d6d8d0',
  'repeat 1,000 right to left': 'be3591e1a8eaae4e81c18aaebcc07be977d8fc31d685ce9aeaf9c14b530b3621',
  'repeat 10,000 without references': '6112468a4cc9fe84e98de0de201792bbe8a5887034ea6515555cf55f7538284c',
  'repeat 10,000 with references': '84a2b6a58d1046029cdd4d729f95172671770f762292cc8b3d2431e5c11be7c0',
};

function written(doc: Record<string, unknown>, stage: 'render' | 'write'): string {
  if (stage === 'render') return withGlyphBudget(1e6, () => renderChart(doc)).svg;
  const spec = parseChart(doc);
  return writeSvg(withGlyphBudget(1e6, () => layoutChart(spec)), { useReferences: spec.useReferences, outlineText: spec.outlineText });
}

describe('the written SVG is byte-identical to the one written before the speed work', () => {
  for (const c of SAME_BYTES_CASES) {
    it(c.name, { timeout: 120_000 }, () => {
      const svg = written(c.doc, c.stage);
      expect(createHash('sha256').update(svg).digest('hex')).toBe(SHA256_BEFORE[c.name]);
    });
  }
});
