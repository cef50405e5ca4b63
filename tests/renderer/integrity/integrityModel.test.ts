// The integrity panel's pure side: grouping by severity, the set-aside list, which button a fix becomes,
// and the adjustment dialogs' forms turned into one action or a list of what is missing.
import { describe, expect, it } from 'vitest';
import { fromChartDocument } from '../../../renderer/src/editor/editorDocument';
import { adjustDocument } from '../../../renderer/src/editor/integrityActions';
import {
  canDismiss,
  formPeriods,
  groupFindings,
  initialPerCapitaForm,
  initialPriceForm,
  withBaseColumn,
  perCapitaAction,
  planFix,
  priceAction,
  priceFixFor,
  setAsideEntries,
} from '../../../renderer/src/integrity/integrityModel';
import type { RuleFindingView } from '../../../renderer/src/render/renderTypes';

const f = (code: string, severity: RuleFindingView['severity'], extra: Partial<RuleFindingView> = {}): RuleFindingView => ({ code, severity, message: code, fix: 'fix', ruleName: code, ...extra });

const series = () =>
  fromChartDocument({
    format: 'tallyglyph.chart/1',
    data: [
      { label: '1982', value: 10000 },
      { label: '2000', value: 20000 },
      { label: '2005', value: 25000 },
    ],
    encoding: { mode: 'repeat', glyph: 'coin', unitName: 'dollars' },
    page: { width: 180, height: 120, unit: 'mm' },
  });

describe('groupFindings and the set-aside list', () => {
  it('groups open findings blocking, warning, advice; dismissed ones are counted out', () => {
    const all = [f('context-thin', 'advice'), f('money-nominal', 'warning'), f('x', 'blocking'), f('time-uneven', 'warning', { dismissedReason: 'gap' })];
    const g = groupFindings(all);
    expect(g.groups.map((x) => [x.severity, x.findings.map((y) => y.code)])).toEqual([
      ['blocking', ['x']],
      ['warning', ['money-nominal']],
      ['advice', ['context-thin']],
    ]);
    expect(g.openCount).toBe(3);
  });

  it('lists every dismissal of the document, with its finding when the rule still fires (a sub-code under its rule code)', () => {
    const hidden = f('scale-inconsistent-gap', 'warning', { category: 'B', dismissedReason: 'on purpose' });
    const entries = setAsideEntries(
      [
        { code: 'scale-inconsistent', category: 'B', reason: 'on purpose' },
        { code: 'context-thin', reason: 'two surveys' },
      ],
      [hidden, f('scale-inconsistent-gap', 'warning', { category: 'C' })],
    );
    expect(entries.map((e) => e.finding)).toEqual([hidden, null]);
  });

  it('never lets a blocking finding be set aside', () => {
    expect(canDismiss({ severity: 'blocking' })).toBe(false);
    expect(canDismiss({ severity: 'warning' })).toBe(true);
    expect(canDismiss({ severity: 'advice' })).toBe(true);
  });
});

describe('planFix', () => {
  it('turns each action kind of the rules into an edit or a dialog, and refuses unsound payloads', () => {
    expect(planFix({ kind: 'show-legend' })).toEqual({ kind: 'edit', action: { type: 'set-show', what: 'legend', on: true } });
    expect(planFix({ kind: 'set-unit', payload: { unit: 25 } })).toEqual({ kind: 'edit', action: { type: 'set-unit', unit: 25 } });
    expect(planFix({ kind: 'set-unit', payload: { unit: -1 } })).toBeNull();
    expect(planFix({ kind: 'set-mode', payload: { mode: 'repeat' } })).toEqual({ kind: 'edit', action: { type: 'set-mode', mode: 'repeat' } });
    expect(planFix({ kind: 'set-rounding', payload: { rounding: 'ink-cut' } })).toEqual({ kind: 'edit', action: { type: 'set-rounding', rounding: 'ink-cut' } });
    expect(planFix({ kind: 'remove-adjustments' })).toEqual({ kind: 'edit', action: { type: 'remove-adjustments' } });
    expect(planFix({ kind: 'reapply-adjustments' })).toEqual({ kind: 'edit', action: { type: 'reapply-adjustments' } });
    expect(planFix({ kind: 'set-source' })).toEqual({ kind: 'dialog', dialog: 'source' });
    expect(planFix({ kind: 'set-unit-name' })).toEqual({ kind: 'dialog', dialog: 'unit-name' });
    expect(planFix({ kind: 'apply-per-capita', payload: { step: { kind: 'per-capita', column: 'population', per: 1000 } } })).toEqual({ kind: 'dialog', dialog: 'per-capita', suggestion: { kind: 'per-capita', column: 'population', per: 1000 } });
    expect(planFix({ kind: 'no-such-kind' })).toBeNull();
    expect(planFix(undefined)).toBeNull();
  });

  it('offers the price dialog for unadjusted money even when the document has no index yet', () => {
    expect(priceFixFor(f('money-nominal', 'warning'))).toEqual({ kind: 'dialog', dialog: 'price-index' });
    expect(priceFixFor(f('context-thin', 'advice'))).toBeNull();
  });
});

describe('the price dialog form', () => {
  it('starts from the labels as periods and the latest period as base, and asks for every missing index value', () => {
    const doc = series();
    const form = initialPriceForm(doc);
    expect(formPeriods(doc, form)).toEqual(['1982', '2000', '2005']);
    expect(form.basePeriod).toBe('2005');
    const out = priceAction(doc, { ...form, indexTexts: { '1982': '96.5', '2000': '', '2005': '0' } });
    expect(out).toEqual({ ok: false, problems: ['2000: enter its index value.', '2005: an index value must be above 0.'] });
  });

  it('gives a price-index step with the typed table; 20,000 x 195.3 / 172.2 = 22,682.93 (Moore ch. 16 conversion, CPI as printed there)', () => {
    const doc = series();
    const form = { ...initialPriceForm(doc), indexTexts: { '1982': '96.5', '2000': '172.2', '2005': '195.3' }, indexName: 'the CPI' };
    const out = priceAction(doc, form);
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.value).toEqual({ type: 'apply-adjustment', step: { kind: 'price-index', basePeriod: '2005' }, priceIndex: { name: 'the CPI', values: { '1982': 96.5, '2000': 172.2, '2005': 195.3 } } });
    const adjusted = adjustDocument(doc, out.value);
    expect(adjusted.ok && Number(adjusted.document.rows[1].valueText).toFixed(2)).toBe('22682.93');
  });

  it('keeps periods that differ from the labels in a period column, and an index per row in an index column', () => {
    const doc = series();
    const base = initialPriceForm(doc);
    const form = { ...base, periodTexts: { ...base.periodTexts, r1: '1983' }, indexBy: 'row' as const, indexTexts: { r1: '99.6', r2: '172.2', r3: '195.3' } };
    const out = priceAction(doc, form);
    expect(out.ok && out.value.step).toEqual({ kind: 'price-index', basePeriod: '2005', periodColumn: 'period', indexColumn: 'price index' });
    expect(out.ok && out.value.columns).toEqual({ period: { values: { '1982': '1983', '2000': '2000', '2005': '2005' } }, 'price index': { values: { '1982': 99.6, '2000': 172.2, '2005': 195.3 } } });
    // 10,000 in 1983 dollars x 195.3 / 99.6 = 19,608.43 in 2005 dollars (computed with the CPI printed in Moore ch. 16).
    const adjusted = out.ok ? adjustDocument(doc, out.value) : null;
    expect(adjusted?.ok && Number(adjusted.document.rows[0].valueText).toFixed(2)).toBe('19608.43');
  });

  it('refuses a base period that is not among the periods', () => {
    const doc = series();
    const out = priceAction(doc, { ...initialPriceForm(doc), basePeriod: '2020', indexTexts: { '1982': '1', '2000': '2', '2005': '3' } });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems[0]).toMatch(/Choose the base period/);
  });
});

describe('the per-capita dialog form', () => {
  const districts = () =>
    fromChartDocument({
      format: 'tallyglyph.chart/1',
      data: [
        { label: 'Northside', value: 54 },
        { label: 'Riverside', value: 91 },
      ],
      encoding: { mode: 'repeat', glyph: 'book', unitName: 'loans' },
      page: { width: 180, height: 120, unit: 'mm' },
      standardise: { columns: { households: { unitName: 'households', values: { Northside: 5000, Riverside: '13,000' } } } },
    });

  it('starts from a size column of the document and the rule\'s suggested base', () => {
    const form = initialPerCapitaForm(districts(), { kind: 'per-capita', column: 'households', per: 1000 });
    expect(form).toEqual({ columnName: 'households', baseName: 'households', baseTexts: { r1: '5000', r2: '13,000' }, per: 1000, customPerText: '' });
  });

  it('gives the rates for a custom base: 54 / 5,000 x 10,000 = 108 (count / base x per, common practice)', () => {
    const doc = districts();
    const form = { ...initialPerCapitaForm(doc), per: 'custom' as const, customPerText: '10,000' };
    const out = perCapitaAction(doc, form);
    expect(out.ok && out.value.step).toEqual({ kind: 'per-capita', column: 'households', per: 10000, baseName: 'households' });
    const adjusted = out.ok ? adjustDocument(doc, out.value) : null;
    expect(adjusted?.ok && adjusted.document.rows.map((r) => r.valueText)).toEqual(['108', '70']);
  });

  it('choosing another column fills its figures and unit; a new name keeps what was typed', () => {
    const doc = fromChartDocument({
      format: 'tallyglyph.chart/1',
      data: [
        { label: 'Northside', value: 54 },
        { label: 'Riverside', value: 91 },
      ],
      encoding: { mode: 'repeat', glyph: 'book' },
      page: { width: 180, height: 120, unit: 'mm' },
      standardise: { columns: { households: { unitName: 'households', values: { Northside: 5000, Riverside: 13000 } }, population: { unitName: 'residents', values: { Northside: 12000, Riverside: 26000 } } } },
    });
    const start = initialPerCapitaForm(doc);
    expect(start.columnName).toBe('households');
    const chosen = withBaseColumn(doc, start, 'population');
    expect([chosen.baseName, chosen.baseTexts]).toEqual(['residents', { r1: '12000', r2: '26000' }]);
    const typed = withBaseColumn(doc, chosen, 'pupils');
    expect([typed.columnName, typed.baseName, typed.baseTexts]).toEqual(['pupils', 'residents', { r1: '12000', r2: '26000' }]);
  });

  it('lists every row without a usable base figure and a bad rate base', () => {
    const doc = districts();
    const out = perCapitaAction(doc, { ...initialPerCapitaForm(doc), baseTexts: { r1: '', r2: '-3' }, per: 'custom', customPerText: '0' });
    expect(out).toEqual({
      ok: false,
      problems: ['The rate base must be a number above 0, such as 10,000.', 'Northside: enter its households figure.', 'Riverside: a rate needs a households figure above 0.'],
    });
  });
});
