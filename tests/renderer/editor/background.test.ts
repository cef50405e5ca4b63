// The page background in the editor: set, cleared and undone as one named action, and written to the document.
import { describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { ACTION_NAMES, perform } from '../../../renderer/src/editor/actions';
import { fromChartDocument, toChartDocument } from '../../../renderer/src/editor/editorDocument';

describe('set-background', () => {
  const start = () => fromChartDocument(DEMO_CHARTS[0].document);

  it('sets a colour, writes it to the document, and clears it back to none', () => {
    const doc = start();
    expect(doc.layout.background).toBeUndefined();
    const coloured = perform(doc, { type: 'set-background', background: '#FBF8F1' });
    expect(coloured.layout.background).toBe('#fbf8f1');
    expect(toChartDocument(coloured).document?.layout?.background).toBe('#fbf8f1');
    const cleared = perform(coloured, { type: 'set-background', background: null });
    expect(cleared.layout.background).toBeUndefined();
    expect(toChartDocument(cleared).document?.layout).not.toHaveProperty('background');
    expect(ACTION_NAMES['set-background']).toBe('background change');
  });

  it('ignores a value that is not an opaque hex colour and a change that changes nothing', () => {
    const doc = start();
    expect(perform(doc, { type: 'set-background', background: 'beige' })).toBe(doc);
    expect(perform(doc, { type: 'set-background', background: null })).toBe(doc);
  });
});
