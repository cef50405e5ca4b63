import { describe, expect, it } from 'vitest';
import { parseChart } from '../../../shared-core/document';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { formatNumber, fromChartDocument, readNumber, rowForProblemPath, toChartDocument } from '../../../renderer/src/editor/editorDocument';

const BIKES = DEMO_CHARTS[0].document;

describe('readNumber', () => {
  it('reads plain decimals, exponents, signs and thousands commas as JavaScript numbers do', () => {
    expect(readNumber('7.5')).toEqual({ ok: true, value: 7.5 });
    expect(readNumber(' 1,234.5 ')).toEqual({ ok: true, value: 1234.5 });
    expect(readNumber('1e3')).toEqual({ ok: true, value: 1000 });
    expect(readNumber('+4')).toEqual({ ok: true, value: 4 });
    expect(readNumber('.25')).toEqual({ ok: true, value: 0.25 });
    expect(readNumber('-3')).toEqual({ ok: true, value: -3 });
  });

  it('refuses text, blanks and a lone decimal comma with a sentence', () => {
    const text = readNumber('lots');
    expect(text.ok).toBe(false);
    expect(!text.ok && text.message).toBe('"lots" is not a number.');
    expect(readNumber('   ')).toEqual({ ok: false, message: 'Enter a value.' });
    const comma = readNumber('7,5');
    expect(!comma.ok && comma.message).toMatch(/write decimals with a point \(7\.5\)/);
    expect(readNumber('1e999').ok).toBe(false);
  });
});

describe('formatNumber', () => {
  it('drops binary floating-point noise (0.1 + 0.2 is 0.30000000000000004 in IEEE 754 doubles)', () => {
    expect(formatNumber(0.1 + 0.2)).toBe('0.3');
    expect(formatNumber(420)).toBe('420');
  });
});

describe('fromChartDocument / toChartDocument', () => {
  it('round-trips a demo document to the same validated chart', () => {
    const ed = fromChartDocument(BIKES);
    const back = toChartDocument(ed);
    expect(back.rowProblems).toEqual([]);
    expect(back.document).not.toBeNull();
    expect(parseChart(back.document)).toEqual(parseChart(BIKES));
  });

  it('keeps a typed value that is not a number and reports it on its cell, without a document', () => {
    const ed = fromChartDocument(BIKES);
    const bad = { ...ed, rows: ed.rows.map((r, i) => (i === 1 ? { ...r, valueText: 'n/a' } : r)) };
    const out = toChartDocument(bad);
    expect(out.document).toBeNull();
    expect(out.rowProblems).toEqual([{ rowId: ed.rows[1].id, field: 'value', message: '"n/a" is not a number.' }]);
    expect(bad.rows[1].valueText).toBe('n/a');
  });

  it('refuses negative values, duplicate labels, unknown glyphs and shares above 1, each on its cell', () => {
    const ed = fromChartDocument(BIKES);
    const rows = ed.rows.map((r, i) => (i === 0 ? { ...r, valueText: '-2' } : i === 2 ? { ...r, label: ed.rows[1].label } : i === 3 ? { ...r, glyph: 'bicyclee' } : r));
    const out = toChartDocument({ ...ed, rows });
    expect(out.document).toBeNull();
    const fields = out.rowProblems.map((p) => `${p.rowId}:${p.field}`);
    expect(fields).toEqual([`${rows[0].id}:value`, `${rows[2].id}:label`, `${rows[3].id}:glyph`]);
    expect(out.rowProblems[0].message).toMatch(/Negative values cannot be drawn/);
    // Says the glyph is unknown and offers near names (by spelling), "bike" among them.
    expect(out.rowProblems[2].message).toMatch(/^The glyph "bicyclee" is unknown: it is not one of the bundled glyphs\. Near names: .*"bike"/);

    const share = toChartDocument({ ...ed, encoding: { ...ed.encoding, mode: 'fill', fillTo: 'share' } });
    expect(share.document).toBeNull();
    expect(share.rowProblems.every((p) => p.field === 'value' && /more than 1/.test(p.message))).toBe(true);
    expect(share.rowProblems).toHaveLength(ed.rows.length);
  });

  it('writes arrangement only in repeat mode and fillTo only in fill mode, as the schema requires', () => {
    const ed = fromChartDocument(BIKES);
    const stack = toChartDocument({ ...ed, encoding: { ...ed.encoding, mode: 'stack' } }).document;
    expect(stack?.encoding).not.toHaveProperty('arrangement');
    expect(stack?.encoding).not.toHaveProperty('fillTo');
    expect(() => parseChart(stack)).not.toThrow();
  });

  it('maps a document problem path to its row and field', () => {
    const ed = fromChartDocument(BIKES);
    expect(rowForProblemPath(ed, 'data[2].label')).toEqual({ rowId: ed.rows[2].id, field: 'label' });
    expect(rowForProblemPath(ed, 'data[9].value')).toBeNull();
    expect(rowForProblemPath(ed, 'encoding.unit')).toBeNull();
  });
});

describe('what the editor does not edit', () => {
  it('keeps standardisation steps, dismissed findings and the all-zero permission through a load and save', () => {
    const perResident = DEMO_CHARTS.find((d) => d.name === 'repeat-library-per-resident')!.document as Record<string, unknown>;
    expect(perResident.standardise).toBeDefined();
    const dismissed = [{ code: 'context-thin', reason: 'Only two years were collected.' }];
    const input = { ...perResident, dismissed, allowAllZero: true };
    const saved = toChartDocument(fromChartDocument(input)).document as Record<string, unknown>;
    expect(saved.standardise).toEqual(perResident.standardise);
    expect(saved.dismissed).toEqual(dismissed);
    expect(saved.allowAllZero).toBe(true);
    // And a document without them stays without them.
    const plain = toChartDocument(fromChartDocument(BIKES)).document as Record<string, unknown>;
    expect(plain).not.toHaveProperty('standardise');
    expect(plain).not.toHaveProperty('dismissed');
    expect(plain).not.toHaveProperty('allowAllZero');
  });
});
