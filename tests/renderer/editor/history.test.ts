import { describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { fromChartDocument } from '../../../renderer/src/editor/editorDocument';
import { canRedo, canUndo, createHistory, historyReducer, MAX_UNDO_STEPS, type History, type HistoryCommand } from '../../../renderer/src/editor/history';

const run = (h: History, ...commands: HistoryCommand[]) => commands.reduce(historyReducer, h);

describe('historyReducer', () => {
  const first = fromChartDocument(DEMO_CHARTS[0].document);
  const rowId = first.rows[0].id;

  it('undo gives back the very document before the change, redo the one after', () => {
    const h0 = createHistory(first);
    const h1 = run(h0, { type: 'perform', action: { type: 'set-mode', mode: 'stack' } });
    const h2 = run(h1, { type: 'perform', action: { type: 'set-rounding', rounding: 'whole' } });
    const undone = run(h2, { type: 'undo' }, { type: 'undo' });
    expect(undone.present).toBe(first);
    expect(canUndo(undone)).toBe(false);
    const redone = run(undone, { type: 'redo' }, { type: 'redo' });
    expect(redone.present).toBe(h2.present);
    expect(canRedo(redone)).toBe(false);
  });

  it('a new change after undo drops the redo branch', () => {
    const h = run(createHistory(first), { type: 'perform', action: { type: 'set-mode', mode: 'stack' } }, { type: 'undo' }, { type: 'perform', action: { type: 'set-mode', mode: 'fill' } });
    expect(canRedo(h)).toBe(false);
    expect(h.present.encoding.mode).toBe('fill');
  });

  it('typing "1", "12", "123" in one cell is one undo step; leaving the cell seals it', () => {
    const typed = run(
      createHistory(first),
      { type: 'perform', action: { type: 'edit-value', rowId, text: '1' } },
      { type: 'perform', action: { type: 'edit-value', rowId, text: '12' } },
      { type: 'perform', action: { type: 'edit-value', rowId, text: '123' } },
    );
    expect(typed.past).toHaveLength(1);
    expect(typed.present.rows[0].valueText).toBe('123');
    expect(run(typed, { type: 'undo' }).present).toBe(first);

    const sealed = run(typed, { type: 'seal' }, { type: 'perform', action: { type: 'edit-value', rowId, text: '1234' } });
    expect(sealed.past).toHaveLength(2);
    expect(run(sealed, { type: 'undo' }).present.rows[0].valueText).toBe('123');
  });

  it('a change that changes nothing leaves no undo step and keeps the revision', () => {
    const h = createHistory(first);
    const same = run(h, { type: 'perform', action: { type: 'set-mode', mode: first.encoding.mode } });
    expect(same).toBe(h);
  });

  it('keeps at most MAX_UNDO_STEPS steps, dropping the oldest', () => {
    let h = createHistory(first);
    for (let i = 0; i < MAX_UNDO_STEPS + 10; i++) {
      h = run(h, { type: 'perform', action: { type: 'set-page-size', width: 100 + i, height: 100 } });
    }
    expect(h.past).toHaveLength(MAX_UNDO_STEPS);
    expect(h.past[0].document.page.width).toBe(100 + 9);
  });

  it('counts a revision for every change of the present document, undo and redo included', () => {
    const h = run(createHistory(first), { type: 'perform', action: { type: 'set-mode', mode: 'stack' } }, { type: 'undo' }, { type: 'redo' });
    expect(h.revision).toBe(3);
  });
});
