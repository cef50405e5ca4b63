import { describe, expect, it } from 'vitest';
import { TallyError } from '../../../../shared-core/errors';
import { CHART_RULES, checkChart, runRules, type ChartRule } from '../../../../shared-core/integrity/rules/index';
import { laid } from './ruleFixtures';

// An invented chart with several problems at once: nominal money over two years, no source, no unit name.
const troubled = (over: Record<string, unknown> = {}) =>
  laid({
    source: undefined,
    data: [
      { label: '2019', value: 400 },
      { label: '2024', value: 520 },
    ],
    encoding: { mode: 'repeat', glyph: 'coin', unit: 40, unitName: 'euros' },
    ...over,
  });

describe('the rule registry', () => {
  it('lists every rule once, each with a stable code, a name of its own and a severity', () => {
    expect(CHART_RULES.map((r) => r.code)).toEqual([
      'money-nominal',
      'size-unadjusted',
      'units-mixed',
      'adjustment-stale',
      'scale-inconsistent',
      'glyphs-unnormalised',
      'perceptual-undisclosed',
      'volume-cue',
      'rounding-error',
      'time-uneven',
      'context-thin',
      'unit-unstated',
      'source-unstated',
      'decoration-heavy',
    ]);
    expect(new Set(CHART_RULES.map((r) => r.name)).size).toBe(CHART_RULES.length);
    // Only lie-factor failures block export by default: none of these rules does.
    expect(CHART_RULES.filter((r) => r.severity === 'blocking')).toEqual([]);
  });

  it('runRules returns the open findings, warnings before advice, each with a message, a fix and a basis', () => {
    const findings = runRules(troubled().spec, troubled().scene);
    expect(findings.map((f) => f.code)).toEqual(['money-nominal', 'source-unstated', 'context-thin']);
    for (const f of findings) {
      expect(f.message.length).toBeGreaterThan(20);
      expect(f.fix.length).toBeGreaterThan(20);
      expect(f.basis).toBeTruthy();
    }
  });

  it('a clean invented chart has no findings', () => {
    expect(runRules(laid().spec, laid().scene)).toEqual([]);
  });
});

describe('dismissing a finding with a reason kept in the document', () => {
  it('moves a dismissed warning aside with its reason; others stay open', () => {
    const chart = troubled({ dismissed: [{ code: 'context-thin', reason: 'The brief compares the two survey years only.' }] });
    const report = checkChart(chart.spec, chart.scene);
    expect(report.findings.map((f) => f.code)).toEqual(['money-nominal', 'source-unstated']);
    expect(report.dismissed).toHaveLength(1);
    expect(report.dismissed[0].reason).toBe('The brief compares the two survey years only.');
    expect(report.dismissed[0].finding.code).toBe('context-thin');
  });

  it('a dismissal for one category leaves the others open; a rule code covers its sub-codes', () => {
    const rule: ChartRule = {
      code: 'demo-rule',
      name: 'Invented rule for the test',
      severity: 'warning',
      run: () => [
        { code: 'demo-rule-part', severity: 'warning', message: 'first', fix: 'x', category: 'A' },
        { code: 'demo-rule-part', severity: 'warning', message: 'second', fix: 'x', category: 'B' },
      ],
    };
    const chart = laid({ dismissed: [{ code: 'demo-rule', category: 'A', reason: 'Checked by hand.' }] });
    const report = checkChart(chart.spec, chart.scene, [rule]);
    expect(report.findings.map((f) => f.category)).toEqual(['B']);
    expect(report.dismissed.map((d) => d.finding.category)).toEqual(['A']);
  });

  it('a blocking finding cannot be dismissed', () => {
    const rule: ChartRule = { code: 'demo-block', name: 'Invented blocking rule', severity: 'blocking', run: () => [{ code: 'demo-block', severity: 'blocking', message: 'stop', fix: 'x' }] };
    const chart = laid({ dismissed: [{ code: 'demo-block', reason: 'Trying to wave it through.' }] });
    const report = checkChart(chart.spec, chart.scene, [rule]);
    expect(report.findings.map((f) => f.code)).toEqual(['demo-block']);
    expect(report.dismissed).toEqual([]);
  });
});

describe('a rule that fails is reported, not dropped', () => {
  it('turns the failure into an advice finding naming the rule, and the other rules still run', () => {
    const broken: ChartRule = {
      code: 'demo-broken',
      name: 'Invented failing rule',
      severity: 'warning',
      run: () => {
        throw new TallyError('data-invalid', 'the column is unreadable.');
      },
    };
    const chart = troubled();
    const report = checkChart(chart.spec, chart.scene, [broken, ...CHART_RULES]);
    expect(report.findings.find((f) => f.code === 'demo-broken-not-run')?.message).toBe('The check "Invented failing rule" could not run: the column is unreadable.');
    expect(report.findings.some((f) => f.code === 'money-nominal')).toBe(true);
  });
});
