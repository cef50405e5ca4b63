// Hostile corpus, data: an empty item in --values once shifted every later value onto the wrong mark
// silently, and a chart of nothing but zeros was written with "lie factor not defined". Tufte's lie
// factor compares effects between values (The Visual Display of Quantitative Information, 1983, p. 57):
// with every value zero there is no effect to compare, and the chart shows no mark at all.
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../../main/cli/index';
import { parseValueSpec } from '../../../shared-core/audit/parseValues';
import { renderChart } from '../../../shared-core/pipeline';
import { renderDocument } from '../../../renderer/src/pipelineAdapter';
import { capture } from '../../helpers/cli';
import { chartDoc } from '../../helpers/chartDoc';
import { caught } from '../../helpers/errors';
import { folderPerTest } from '../../helpers/tempDirs';

const work = folderPerTest('tallyglyph-data-');
const BARS = '<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm" viewBox="0 0 100 100"><rect id="a" x="10" y="50" width="10" height="20"/><rect id="b" x="40" y="30" width="10" height="40"/><rect id="c" x="70" y="10" width="10" height="60"/></svg>';

describe('--values with an empty item is refused, naming its position', () => {
  it('parseValueSpec names the empty item and the count', () => {
    expect(caught(() => parseValueSpec('18,,27.5')).message).toMatch(/^Item 2 of 3 in the values is empty/);
    expect(caught(() => parseValueSpec('18,27.5,')).message).toMatch(/^Item 3 of 3 in the values is empty/);
    expect(caught(() => parseValueSpec(',18')).message).toMatch(/^Item 1 of 2 in the values is empty/);
    expect(caught(() => parseValueSpec('a=1, ,b=2')).message).toMatch(/^Item 2 of 3 in the values is empty/);
    expect(caught(() => parseValueSpec(' , ')).message).toMatch(/^No values were given/);
    expect(parseValueSpec('18, 27.5,3')).toEqual({ kind: 'ordered', values: [18, 27.5, 3] });
  });

  for (const command of ['audit', 'correct', 'sheet']) {
    it(`${command} refuses 18,,27.5 before reading any mark`, async () => {
      const input = path.join(work.dir, 'bars.svg');
      fs.writeFileSync(input, BARS);
      const io = capture(work.dir);
      const out = command === 'audit' ? [] : ['-o', `out.${command === 'sheet' ? 'png' : 'svg'}`];
      const code = await main([command, input, '--values', '18,,27.5', ...out], io);
      expect(code).toBe(2);
      expect(io.err).toMatch(/Item 2 of 3 in the values is empty/);
      expect(fs.readdirSync(work.dir)).toEqual(['bars.svg']);
    });
  }
});

describe('a chart whose values are all zero', () => {
  const zeros = () => chartDoc({ data: [{ label: 'Alder Street', value: 0 }, { label: 'Birch Road', value: 0 }] });

  it('is refused in plain words before layout, saying how to ask for it', () => {
    const e = caught(() => renderChart(zeros()));
    expect(e.code).toBe('data-invalid');
    expect(e.message).toMatch(/^Every value is zero \(all 2 rows\), so there is nothing to compare/);
    expect(e.message).toMatch(/"allowAllZero": true/);
  });

  it('is written when the document asks, and says there was nothing to compare', () => {
    const result = renderChart({ ...zeros(), allowAllZero: true });
    expect(result.report.lieFactor.worst).toBeNull();
    expect(JSON.stringify(result.report)).toMatch(/Every value is zero/);
    expect(result.scene.marks.every((m) => m.glyphs.length === 0)).toBe(true);
  });

  it('one zero among other values is still drawn as nothing, not refused', () => {
    const result = renderChart(chartDoc({ data: [{ label: 'Alder Street', value: 0 }, { label: 'Birch Road', value: 30 }, { label: 'Cedar Lane', value: 60 }] }));
    expect(result.report.pass).toBe(true);
  });

  it('render on the command line refuses it and writes nothing; --allow-all-zero writes it', async () => {
    const file = path.join(work.dir, 'zeros.json');
    fs.writeFileSync(file, JSON.stringify(zeros()));
    const refused = capture(work.dir);
    expect(await main(['render', file, '-o', 'zeros.svg'], refused)).toBe(2);
    expect(refused.err).toMatch(/nothing to compare/);
    expect(fs.existsSync(path.join(work.dir, 'zeros.svg'))).toBe(false);
    const allowed = capture(work.dir);
    expect(await main(['render', file, '-o', 'zeros.svg', '--allow-all-zero'], allowed)).toBe(0);
    expect(allowed.out).toMatch(/worst lie factor not defined \(nothing to compare\)/);
    expect(fs.existsSync(path.join(work.dir, 'zeros.svg'))).toBe(true);
  });

  it('the app shows the refusal instead of a chart', () => {
    const outcome = renderDocument(zeros());
    expect(outcome.kind).toBe('failed');
    expect(outcome.kind === 'failed' && outcome.message).toMatch(/nothing to compare/);
  });
});
