// Speed work on layout, the writer and embedding must not change a single byte of what is written. The
// hashes were taken from the code without that work (b208529 plus this stop's new layout options, fill sizing and
// value labels to their row's ink; the speed changes were then shown to leave every one unchanged); a deliberate change to the output of
// these charts (new layout defaults, a writer change) must come with new hashes, from `sha256sum` of the
// files the old and the new code write, never copied from a failing run without looking at the difference.
// Writer change since: a full glyph of a shared shape is written as the shape's rounded coordinates plus a rounded
// offset anchored at its ink box's left and bottom edges (svg/translatedPathData.ts), in full and as <use> alike.
// Looked at: the same elements and number of coordinates in every file, coordinates moved by at most 0.001 mm,
// fill charts unchanged, and only the measured lie factor changed in the summaries (bike demo 0.99996 -> 0.99994).
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
  'demo repeat-bike-share': '1c1d66186b82e3133d777302a9d6d4b4b682fa80d8e9bfb5e71e75701f509953',
  'demo repeat-bike-share with references': '37342e6418058ac50dba9632fce9fbe5801c27cd5bbe3c18307bfc64c69ffffe',
  'demo stack-cafe-cups': '58be6db0dde11c8e20285c77f3b0aaccecee05add7c473b23958e724ae10a18a',
  'demo stack-cafe-cups with references': '989465dbade52d2403d5fcc0ea304ff7fc5ee953efbc3beb6ab01d802c49f4d9',
  'demo scale-trees-planted': 'fc4ba43245e2393130b839ccdc0c374b0cea41e2dd6b775dcaba7780cc6e34e2',
  'demo scale-trees-planted with references': 'fc4ba43245e2393130b839ccdc0c374b0cea41e2dd6b775dcaba7780cc6e34e2',
  'demo fill-planting-target': '49f3a5b2ddda670b137f3aa6194694d83d6255e48921dd24e2b0f625129f0c7e',
  'demo fill-planting-target with references': '49f3a5b2ddda670b137f3aa6194694d83d6255e48921dd24e2b0f625129f0c7e',
  'demo icon-array-commute': '0ba0d4daf443855a82b7327fa1fbffe82e7ac5bf1baddfabf9a24bd719e2c31a',
  'demo icon-array-commute with references': 'eccd8113d03b437220e5d6547ff5b8dd97fc25959ea40a2d155e57a6105dea11',
  'demo repeat-library-per-resident': 'b792d551e3d425cd760caf67b449b948cac7d06e2cada5a53baae9fb9a51dc69',
  'demo repeat-library-per-resident with references': '78170ea437504dcc53c0912d5e6b96512cbfe5c1de74a53bf1cc97bdddafa1f0',
  'repeat 1,000 with references': '402384e26c1e1487d9b80cbaed9de39af6d95b91b0e379141f70259e809ffa5b',
  'repeat 1,000 without references': '2a18974cde21f8c70850844bd810f2809d0745bf35039d4a7caa303d51e23b0c',
  'repeat 1,000 shared grid': '4aa8e3dd701d0d25527c05b7a9fb15a3ff577bf767c40914b8f38dbd55a8e803',
  'repeat 1,000 right to left': '9561067744f46860d3514878e9d0618a052b579fb29eda31e010f9342cb9f39f',
  'repeat 10,000 without references': 'aec8c38e40e17a31baf42c1b6c58f818a2300e8ec6d6ff45478d662d53a43ea0',
  'repeat 10,000 with references': 'ee31fe5f0d3c1815c6d5174f51be0c75c6ffaf2594f7d9e019240d984e8825e0',
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
