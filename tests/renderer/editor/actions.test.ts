import { describe, expect, it } from 'vitest';
import { PAGE_UNIT_MM } from '../../../shared-core/document';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { coalesceKey, perform, type Action } from '../../../renderer/src/editor/actions';
import { fromChartDocument, toChartDocument } from '../../../renderer/src/editor/editorDocument';

const start = () => fromChartDocument(DEMO_CHARTS[0].document);

describe('perform', () => {
  it('returns the very same document for a change that changes nothing', () => {
    const doc = start();
    const same: Action[] = [
      { type: 'set-title', title: doc.title },
      { type: 'set-mode', mode: doc.encoding.mode },
      { type: 'edit-value', rowId: doc.rows[0].id, text: doc.rows[0].valueText },
      { type: 'move-row', rowId: doc.rows[0].id, by: -1 },
      { type: 'remove-row', rowId: 'no-such-row' },
      { type: 'set-page-size', width: -1, height: 10 },
      { type: 'set-unit', unit: 0 },
      { type: 'set-bleed', bleedMm: Number.NaN },
      { type: 'paste-table', text: '   ' },
    ];
    for (const action of same) expect(perform(doc, action)).toBe(doc);
  });

  it('never mutates its input', () => {
    const doc = start();
    const frozen = JSON.stringify(doc);
    perform(doc, { type: 'edit-value', rowId: doc.rows[1].id, text: '99' });
    perform(doc, { type: 'add-row' });
    perform(doc, { type: 'paste-table', text: 'a\t1\nb\t2' });
    perform(doc, { type: 'set-page-unit', unit: 'in' });
    expect(JSON.stringify(doc)).toBe(frozen);
  });

  it('keeps typed text as it is, even when it is not a number', () => {
    const doc = start();
    const next = perform(doc, { type: 'edit-value', rowId: doc.rows[1].id, text: 'twelve' });
    expect(next.rows[1].valueText).toBe('twelve');
    expect(next.rows[0]).toBe(doc.rows[0]);
  });

  it('adds rows with fresh ids and unused labels, and removes and moves them', () => {
    const doc = start();
    const added = perform(doc, { type: 'add-row', afterRowId: doc.rows[0].id });
    expect(added.rows).toHaveLength(doc.rows.length + 1);
    expect(added.rows[1].id).not.toBe(doc.rows[1].id);
    expect(new Set(added.rows.map((r) => r.id)).size).toBe(added.rows.length);
    expect(new Set(added.rows.map((r) => r.label)).size).toBe(added.rows.length);
    const removed = perform(added, { type: 'remove-row', rowId: added.rows[1].id });
    expect(removed.rows.map((r) => r.id)).toEqual(doc.rows.map((r) => r.id));
    const moved = perform(doc, { type: 'move-row', rowId: doc.rows[0].id, by: 1 });
    expect(moved.rows.map((r) => r.label)).toEqual([doc.rows[1].label, doc.rows[0].label, ...doc.rows.slice(2).map((r) => r.label)]);
  });

  it('pastes from a row onward, overwriting and then adding rows', () => {
    const doc = start();
    const next = perform(doc, { type: 'paste-table', text: 'X\t1\nY\t2\nZ\t3\nW\t4\nV\t5', atRowId: doc.rows[2].id });
    expect(next.rows.map((r) => r.label)).toEqual([doc.rows[0].label, doc.rows[1].label, 'X', 'Y', 'Z', 'W', 'V']);
    expect(next.rows[2].id).toBe(doc.rows[2].id);
    const replaced = perform(doc, { type: 'paste-table', text: 'only,1' });
    expect(replaced.rows.map((r) => [r.label, r.valueText])).toEqual([['only', '1']]);
  });

  it('converts the page between units by CSS absolute units (1 in = 25.4 mm)', () => {
    const doc = start();
    expect(doc.page).toEqual({ width: 180, height: 120, unit: 'mm' });
    const inches = perform(doc, { type: 'set-page-unit', unit: 'in' });
    expect(inches.page.unit).toBe('in');
    expect(inches.page.width).toBeCloseTo(180 / 25.4, 3);
    expect(inches.page.height).toBeCloseTo(120 / 25.4, 3);
    expect(PAGE_UNIT_MM.in).toBe(25.4);
    const back = perform(inches, { type: 'set-page-unit', unit: 'mm' });
    expect(Math.abs(back.page.width - 180)).toBeLessThan(0.02);
  });

  it('switching modes keeps the repeat arrangement for when repeat comes back', () => {
    const doc = perform(start(), { type: 'set-arrangement', arrangement: 'shared-grid' });
    const fill = perform(doc, { type: 'set-mode', mode: 'fill' });
    expect(toChartDocument(fill).document?.encoding).not.toHaveProperty('arrangement');
    const again = perform(fill, { type: 'set-mode', mode: 'repeat' });
    expect(toChartDocument(again).document?.encoding.arrangement).toBe('shared-grid');
  });

  it('automatic unit removes the unit from the document; a number puts it back', () => {
    const doc = start();
    const auto = perform(doc, { type: 'set-unit', unit: null });
    expect(toChartDocument(auto).document?.encoding).not.toHaveProperty('unit');
    expect(toChartDocument(perform(auto, { type: 'set-unit', unit: 25 })).document?.encoding.unit).toBe(25);
  });

  it('merges typing in one cell into one undo step, and nothing else', () => {
    expect(coalesceKey({ type: 'edit-value', rowId: 'r1', text: '1' })).toBe(coalesceKey({ type: 'edit-value', rowId: 'r1', text: '12' }));
    expect(coalesceKey({ type: 'edit-value', rowId: 'r1', text: '1' })).not.toBe(coalesceKey({ type: 'edit-value', rowId: 'r2', text: '1' }));
    expect(coalesceKey({ type: 'set-mode', mode: 'stack' })).toBeNull();
  });
});
