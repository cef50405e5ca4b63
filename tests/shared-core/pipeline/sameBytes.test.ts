// Speed work on layout, the writer and embedding must not change a single byte of what is written. The
// hashes were taken from the code without that work (b208529 plus this stop's new layout options, fill sizing and
// value labels to their row's ink; the speed changes were then shown to leave every one unchanged); a deliberate change to the output of
// these charts (new layout defaults, a writer change) must come with new hashes, from `sha256sum` of the
// files the old and the new code write, never copied from a failing run without looking at the difference.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { parseChart } from '../../../shared-core/document/index';
import { layoutChart, withGlyphBudget } from '../../../shared-core/layout/index';
import { renderChart } from '../../../shared-core/pipeline/index';
import { writeSvg } from '../../../shared-core/svg/index';
import { SAME_BYTES_CASES } from './sameBytesCases';

// The three shared-grid charts were re-hashed when the grid's key list was planned as wide as its widest entry's
// ink, its left edge on the file's 0.001 mm grid: the same glyphs and list, the whole block moved right by
// 0.13-0.15 mm so that it is centred on the page.
const SHA256_BEFORE: Record<string, string> = {
  'demo repeat-bike-share': 'b5ad973ac26aa9a80ffcfa3d8ad1ed1ccee980e41ff99fb8f149e1f3c87858e6',
  'demo repeat-bike-share with references': 'd0e08036470f983c67ab97b6498629e1f1515de7d488a30c370d5961508bce1f',
  'demo stack-cafe-cups': '09fbce20ac62db1671d583588dbf482106f9ba5f173a950840ce24e8e8121868',
  'demo stack-cafe-cups with references': '989465dbade52d2403d5fcc0ea304ff7fc5ee953efbc3beb6ab01d802c49f4d9',
  'demo scale-trees-planted': '607340c03f1f83fe736d96bb907275bd956304b0517d4add1eda4825ec20c946',
  'demo scale-trees-planted with references': '607340c03f1f83fe736d96bb907275bd956304b0517d4add1eda4825ec20c946',
  'demo fill-planting-target': '49f3a5b2ddda670b137f3aa6194694d83d6255e48921dd24e2b0f625129f0c7e',
  'demo fill-planting-target with references': '49f3a5b2ddda670b137f3aa6194694d83d6255e48921dd24e2b0f625129f0c7e',
  'demo icon-array-commute': 'c9ff37490d998b3305af50fa172f6a046cd11c5ccd30ebe9516eb62c8d1f8241',
  'demo icon-array-commute with references': 'd0c29c56e27f029cc2a3868a8bf547ea0c99a584fdfe37819f1a0bef6fadf173',
  'demo repeat-library-per-resident': 'c1fc31198e1f4aeb3834ad58544bd5c0471e611ee74a6f04b293b70b85bef132',
  'demo repeat-library-per-resident with references': 'ad8c728f74967bbd582baee5f893b5184e87b4affddde0390761163688a7a379',
  'repeat 1,000 with references': '4287809af8f3eb6608d48eb2bd1f11d20c49ad428ac961592c6280b2bb22d4ae',
  'repeat 1,000 without references': '354a4d3b572b18d93b1a2f9d191e7253c0fc798fdebf0be7d2615aeeff78bee8',
  'repeat 1,000 shared grid': '8458960c8b7bb55f3b6d5e2b4474fcfb7106075159073c14a2b77c8053a416b2',
  'repeat 1,000 right to left': '3d2d6f3c2c69cd9cb197c0ba8c0585a4953a5d20d224c38c5d62d689c1276ac7',
  'repeat 10,000 without references': '557bdb06a3225d41df03942ba52a5f1ea4559e4d2e5292e87fef67468c2bee97',
  'repeat 10,000 with references': '574b565adf3c13e31debfdfa27ea1ba0d9f973d9fda5c5e25d64a72c5887dd25',
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
