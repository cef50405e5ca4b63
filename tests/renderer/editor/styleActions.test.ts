// The layout and style controls' actions: each sets its document field, refuses what the document format
// refuses, writes nothing at the default (so an untouched document saves back unchanged), survives the
// round trip through a saved chart document, and is one undo step per visit to a control.
import { describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { parseChart, SOURCE_SIZE_PT_RANGE, TITLE_SIZE_PT_RANGE } from '../../../shared-core/document';
import { ACTION_NAMES, coalesceKey, perform, type Action } from '../../../renderer/src/editor/actions';
import { fromChartDocument, toChartDocument, type EditorDocument } from '../../../renderer/src/editor/editorDocument';
import { createHistory, historyReducer } from '../../../renderer/src/editor/history';

const start = () => fromChartDocument(DEMO_CHARTS[0].document);

function run(doc: EditorDocument, actions: Action[]): EditorDocument {
  return actions.reduce(perform, doc);
}

/** The document as saved and opened again. */
function roundTrip(doc: EditorDocument): EditorDocument {
  const saved = toChartDocument(doc).document;
  if (!saved) throw new Error('the document did not convert');
  return fromChartDocument(JSON.parse(JSON.stringify(saved)));
}

describe('style actions', () => {
  it('set every layout and style field, and each survives Save and Open', () => {
    const doc = start();
    const id = doc.rows[1].id;
    const next = run(doc, [
      { type: 'set-row-color', rowId: id, color: '#0B6E4F' },
      { type: 'set-glyph-size', glyphSizeMm: 6.5 },
      { type: 'set-gap', gapRatio: 0.5 },
      { type: 'set-columns', columns: 4 },
      { type: 'set-direction', direction: 'rtl' },
      { type: 'set-group-every', groupEvery: 5 },
      { type: 'set-label-position', labelPosition: 'above' },
      { type: 'set-label-align', labelAlign: 'end' },
      { type: 'set-value-unit', valueUnit: 'L' },
      { type: 'set-sort', sort: 'descending' },
      { type: 'set-title-size', sizePt: 20 },
      { type: 'set-source-size', sizePt: 9 },
      { type: 'set-font', font: 'serif' },
      { type: 'set-key-wording', keyWording: 'Each bike = {amount} {unit}' },
      { type: 'set-show', what: 'legend', on: false },
      { type: 'set-background', background: '#FDF6E3' },
    ]);
    const saved = toChartDocument(next).document!;
    // The saved document is one the format accepts (the schema is the outside contract of the file).
    const spec = parseChart(saved);
    expect(spec.data[1].color).toBe('#0b6e4f');
    expect(spec.layout).toMatchObject({
      glyphSizeMm: 6.5,
      gapRatio: 0.5,
      columns: 4,
      direction: 'rtl',
      groupEvery: 5,
      labelPosition: 'above',
      labelAlign: 'end',
      valueUnit: 'L',
      sort: 'descending',
      titleSizePt: 20,
      sourceSizePt: 9,
      font: 'serif',
      keyWording: 'Each bike = {amount} {unit}',
      legend: false,
      background: '#fdf6e3',
    });
    const reopened = roundTrip(next);
    expect(reopened.layout).toEqual(next.layout);
    expect(reopened.rows.map((r) => r.color)).toEqual(next.rows.map((r) => r.color));
    // The table keeps the designer's order whatever the chart's sort.
    expect(reopened.rows.map((r) => r.label)).toEqual(doc.rows.map((r) => r.label));
  });

  it('writes nothing for a choice put back to its default, so the document saves back as it was opened', () => {
    const doc = start();
    const before = JSON.stringify(toChartDocument(doc).document);
    const back = run(doc, [
      { type: 'set-group-every', groupEvery: 10 },
      { type: 'set-group-every', groupEvery: 0 },
      { type: 'set-sort', sort: 'ascending' },
      { type: 'set-sort', sort: 'given' },
      { type: 'set-font', font: 'serif' },
      { type: 'set-font', font: 'sans' },
      { type: 'set-label-position', labelPosition: 'above' },
      { type: 'set-label-position', labelPosition: 'beside' },
      { type: 'set-value-unit', valueUnit: 'kWh' },
      { type: 'set-value-unit', valueUnit: '' },
      { type: 'set-key-wording', keyWording: '{amount}' },
      { type: 'set-key-wording', keyWording: '' },
      { type: 'set-title-size', sizePt: 30 },
      { type: 'set-title-size', sizePt: null },
      { type: 'set-glyph-size', glyphSizeMm: 9 },
      { type: 'set-glyph-size', glyphSizeMm: null },
      { type: 'set-row-color', rowId: doc.rows[0].id, color: '#123456' },
      { type: 'set-row-color', rowId: doc.rows[0].id, color: null },
    ]);
    expect(JSON.stringify(toChartDocument(back).document)).toBe(before);
  });

  it('refuses values the document format refuses, returning the very same document', () => {
    const doc = start();
    const refused: Action[] = [
      { type: 'set-row-color', rowId: doc.rows[0].id, color: 'green' },
      { type: 'set-row-color', rowId: 'no-such-row', color: '#123456' },
      { type: 'set-glyph-size', glyphSizeMm: 0 },
      { type: 'set-glyph-size', glyphSizeMm: Number.NaN },
      { type: 'set-gap', gapRatio: -0.1 },
      // chartSchema: the gap is at most 10 glyph sizes.
      { type: 'set-gap', gapRatio: 10.5 },
      { type: 'set-columns', columns: 0 },
      { type: 'set-columns', columns: 2.5 },
      { type: 'set-title-size', sizePt: TITLE_SIZE_PT_RANGE.min - 1 },
      { type: 'set-title-size', sizePt: TITLE_SIZE_PT_RANGE.max + 1 },
      { type: 'set-source-size', sizePt: SOURCE_SIZE_PT_RANGE.max + 0.5 },
      { type: 'set-direction', direction: doc.layout.direction },
      { type: 'set-sort', sort: 'given' },
    ];
    for (const action of refused) expect(perform(doc, action), JSON.stringify(action)).toBe(doc);
  });

  it('keeps a key wording without {amount} as typed; the document check refuses it with a sentence naming {amount}', () => {
    const doc = perform(start(), { type: 'set-key-wording', keyWording: 'Each bike = 50 rides' });
    expect(doc.layout.keyWording).toBe('Each bike = 50 rides');
    const saved = toChartDocument(doc).document!;
    expect(() => parseChart(saved)).toThrow(/\{amount\}/);
  });

  it('merges typing in a number or text field and a colour drag into one undo step; choices are one step each', () => {
    let h = createHistory(start());
    const id = h.present.rows[0].id;
    const typed: Action[] = [
      { type: 'set-title-size', sizePt: 2 * 10, typing: true },
      { type: 'set-title-size', sizePt: 24, typing: true },
    ];
    for (const action of typed) h = historyReducer(h, { type: 'perform', action });
    expect(h.past).toHaveLength(1);
    h = historyReducer(h, { type: 'seal' });
    for (const color of ['#101010', '#202020', '#303030']) h = historyReducer(h, { type: 'perform', action: { type: 'set-row-color', rowId: id, color, typing: true } });
    expect(h.past).toHaveLength(2);
    h = historyReducer(h, { type: 'seal' });
    for (const valueUnit of ['k', 'kW', 'kWh']) h = historyReducer(h, { type: 'perform', action: { type: 'set-value-unit', valueUnit } });
    expect(h.past).toHaveLength(3);
    h = historyReducer(h, { type: 'seal' });
    h = historyReducer(h, { type: 'perform', action: { type: 'set-sort', sort: 'descending' } });
    h = historyReducer(h, { type: 'perform', action: { type: 'set-sort', sort: 'ascending' } });
    expect(h.past).toHaveLength(5);
    expect(coalesceKey({ type: 'set-font', font: 'serif' })).toBeNull();
    // A drag in a palette swatch's or the background's picker is one step too.
    expect(coalesceKey({ type: 'set-colors', colors: ['#111111'], typing: true })).toBe(coalesceKey({ type: 'set-colors', colors: ['#222222'], typing: true }));
    expect(coalesceKey({ type: 'set-background', background: '#111111', typing: true })).not.toBeNull();
    expect(coalesceKey({ type: 'set-colors', colors: ['#111111'] })).toBeNull();

    // Undo walks back one visit at a time.
    h = historyReducer(h, { type: 'undo' });
    h = historyReducer(h, { type: 'undo' });
    h = historyReducer(h, { type: 'undo' });
    expect(h.present.layout.valueUnit).toBeUndefined();
    expect(h.present.rows[0].color).toBe('#303030');
    h = historyReducer(h, { type: 'undo' });
    expect(h.present.rows[0].color).toBeUndefined();
    expect(h.present.layout.titleSizePt).toBe(24);
    h = historyReducer(h, { type: 'undo' });
    expect(h.present.layout.titleSizePt).toBeUndefined();
  });

  it('names every new action for the undo button', () => {
    const names = ['set-row-color', 'set-glyph-size', 'set-gap', 'set-columns', 'set-direction', 'set-group-every', 'set-label-position', 'set-label-align', 'set-value-unit', 'set-sort', 'set-title-size', 'set-source-size', 'set-font', 'set-key-wording'] as const;
    for (const n of names) expect(ACTION_NAMES[n]).toMatch(/change$/);
  });
});
