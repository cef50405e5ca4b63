// The integrity panel's edits: adjustments applied to the editor's table as one undo step, kept in the
// saved document, removed and replayed; findings set aside with a required reason and brought back.
import { describe, expect, it } from 'vitest';
import { perform } from '../../../renderer/src/editor/actions';
import { fromChartDocument, toChartDocument } from '../../../renderer/src/editor/editorDocument';
import { createHistory, historyReducer } from '../../../renderer/src/editor/history';
import { adjustDocument } from '../../../renderer/src/editor/integrityActions';
import { renderChart } from '../../../shared-core/pipeline';

// US CPI-U annual averages (1982-84 = 100) as printed in Moore, Statistics: Concepts and Controversies, ch. 16.
const CPI = { '1982': 96.5, '2000': 172.2, '2005': 195.3 };

const takings = () =>
  fromChartDocument({
    format: 'tallyglyph.chart/1',
    title: 'Festival takings',
    data: [
      { label: '1982', value: 10000 },
      { label: '2000', value: 20000 },
      { label: '2005', value: 25000 },
    ],
    encoding: { mode: 'repeat', glyph: 'coin', unit: 1000, unitName: 'dollars' },
    page: { width: 180, height: 120, unit: 'mm' },
  });

const loans = () =>
  fromChartDocument({
    format: 'tallyglyph.chart/1',
    data: [
      { label: 'Northside', value: 54 },
      { label: 'Riverside', value: 91 },
    ],
    encoding: { mode: 'repeat', glyph: 'book', unitName: 'loans' },
    page: { width: 180, height: 120, unit: 'mm' },
  });

describe('apply-adjustment', () => {
  it('converts to one period\'s money with a typed index: 10,000 x 195.3 / 96.5 = 20,238.34 (Moore ch. 16 conversion)', () => {
    const doc = perform(takings(), { type: 'apply-adjustment', step: { kind: 'price-index', basePeriod: '2005' }, priceIndex: { name: 'the CPI', values: CPI } });
    expect(Number(doc.rows[0].valueText).toFixed(2)).toBe('20238.34');
    expect(Number(doc.rows[1].valueText).toFixed(2)).toBe('22682.93');
    expect(doc.rows[2].valueText).toBe('25000');
    expect(doc.encoding.unitName).toBe('dollars (2005 money)');
    // The amount per glyph was set for the old values; it goes back to automatic.
    expect(doc.encoding.unit).toBeUndefined();
    const saved = toChartDocument(doc).document!;
    expect(saved.standardise?.priceIndex).toEqual({ name: 'the CPI', values: CPI });
    expect(saved.standardise?.adjustments?.original.values).toEqual({ '1982': 10000, '2000': 20000, '2005': 25000 });
    // Saved and opened again, the document carries the same steps and the chart prints the footnote.
    const reopened = fromChartDocument(JSON.parse(JSON.stringify(saved)));
    expect(reopened.carried?.standardise).toEqual(saved.standardise);
    const written = renderChart(toChartDocument(reopened).document);
    expect(written.svg).toContain('Figures adjusted to 2005 money with the CPI.');
    expect(written.report.pass).toBe(true);
  });

  it('divides by a typed population column: 54 / 12,000 x 100,000 = 450 (rate per 100,000 = count / population x 100,000, common practice)', () => {
    const doc = perform(loans(), {
      type: 'apply-adjustment',
      step: { kind: 'per-capita', column: 'population', per: 100_000, baseName: 'residents' },
      columns: { population: { unitName: 'residents', values: { Northside: 12000, Riverside: 26000 } } },
    });
    expect(doc.rows.map((r) => r.valueText)).toEqual(['450', '350']);
    expect(doc.encoding.unitName).toBe('loans per 100,000 residents');
    expect(doc.carried?.standardise?.columns?.population.values).toEqual({ Northside: 12000, Riverside: 26000 });
  });

  it('refuses a zero population with a sentence naming the row, and leaves the document as it was', () => {
    const doc = loans();
    const action = { type: 'apply-adjustment' as const, step: { kind: 'per-capita' as const, column: 'population', per: 1000 }, columns: { population: { values: { Northside: 0, Riverside: 26000 } } } };
    const out = adjustDocument(doc, action);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.message).toMatch(/Northside.*above 0/);
    expect(perform(doc, action)).toBe(doc);
  });

  it('refuses a table with a half-typed value instead of guessing it', () => {
    const doc = perform(loans(), { type: 'edit-value', rowId: 'r2', text: '9,1' });
    const out = adjustDocument(doc, { type: 'apply-adjustment', step: { kind: 'share-of-total' } });
    expect(out).toEqual({ ok: false, message: expect.stringMatching(/^Fix the table first: row 2 \(Riverside\)/) });
  });
});

describe('remove-adjustments and reapply-adjustments', () => {
  const adjusted = () =>
    perform(loans(), { type: 'apply-adjustment', step: { kind: 'per-capita', column: 'population', per: 1000 }, columns: { population: { unitName: 'residents', values: { Northside: 6000, Riverside: 13000 } } } });

  it('removal brings back the values and unit as given and keeps the typed columns', () => {
    const doc = perform(adjusted(), { type: 'remove-adjustments' });
    expect(doc.rows.map((r) => r.valueText)).toEqual(['54', '91']);
    expect(doc.encoding.unitName).toBe('loans');
    expect(doc.carried?.standardise?.adjustments).toBeUndefined();
    expect(doc.carried?.standardise?.columns?.population).toBeDefined();
  });

  it('replay after a hand edit gives the recorded result again: 54 / 6,000 x 1,000 = 9', () => {
    const edited = perform(adjusted(), { type: 'edit-value', rowId: 'r1', text: '12' });
    const doc = perform(edited, { type: 'reapply-adjustments' });
    expect(doc.rows.map((r) => r.valueText)).toEqual(['9', '7']);
  });

  it('removal with nothing applied says so', () => {
    expect(adjustDocument(loans(), { type: 'remove-adjustments' })).toEqual({ ok: false, message: 'No adjustment is applied to this chart.' });
  });
});

describe('dismiss-finding and bring-back-finding', () => {
  it('keeps a dismissal only with a non-empty reason, replaces one for the same finding, and removes it on bring back', () => {
    const doc = loans();
    expect(perform(doc, { type: 'dismiss-finding', code: 'context-thin', reason: '   ' })).toBe(doc);
    const once = perform(doc, { type: 'dismiss-finding', code: 'context-thin', reason: ' Two survey years. ' });
    expect(once.carried?.dismissed).toEqual([{ code: 'context-thin', reason: 'Two survey years.' }]);
    const twice = perform(once, { type: 'dismiss-finding', code: 'context-thin', reason: 'The brief compares two years.' });
    expect(twice.carried?.dismissed).toEqual([{ code: 'context-thin', reason: 'The brief compares two years.' }]);
    const withCategory = perform(twice, { type: 'dismiss-finding', code: 'time-uneven', category: '2000', reason: 'No festival in between.' });
    expect(toChartDocument(withCategory).document?.dismissed).toEqual([
      { code: 'context-thin', reason: 'The brief compares two years.' },
      { code: 'time-uneven', category: '2000', reason: 'No festival in between.' },
    ]);
    const back = perform(withCategory, { type: 'bring-back-finding', code: 'context-thin' });
    expect(back.carried?.dismissed).toEqual([{ code: 'time-uneven', category: '2000', reason: 'No festival in between.' }]);
    const none = perform(back, { type: 'bring-back-finding', code: 'time-uneven', category: '2000' });
    expect(none.carried).toBeUndefined();
    expect(perform(none, { type: 'bring-back-finding', code: 'time-uneven' })).toBe(none);
  });

  it('is one undo step each', () => {
    let h = createHistory(loans());
    h = historyReducer(h, { type: 'perform', action: { type: 'dismiss-finding', code: 'source-unstated', reason: 'Source on the poster.' } });
    h = historyReducer(h, { type: 'perform', action: { type: 'apply-adjustment', step: { kind: 'share-of-total' } } });
    expect(h.past.map((s) => s.action)).toEqual(['dismiss-finding', 'apply-adjustment']);
    h = historyReducer(h, { type: 'undo' });
    expect(h.present.rows.map((r) => r.valueText)).toEqual(['54', '91']);
    expect(h.present.carried?.dismissed).toHaveLength(1);
    h = historyReducer(h, { type: 'undo' });
    expect(h.present.carried).toBeUndefined();
  });
});
