// A new chart: the settings of a sensible starting chart, an empty table of one row, no title.
import type { EditorDocument } from '../editor/editorDocument';

/** A blank chart from `template` (its mode, glyph, page and layout kept; its data, title and unit dropped). */
export function blankDocument(template: EditorDocument): EditorDocument {
  return {
    ...template,
    title: '',
    source: '',
    rows: [{ id: 'r1', label: '', valueText: '' }],
    encoding: { ...template.encoding, unit: undefined, unitName: undefined },
    nextRowNumber: 2,
  };
}

/** True while nothing has been typed in the table yet: the preview shows how to start instead of a chart. */
export function isBlank(doc: EditorDocument): boolean {
  return doc.rows.every((r) => r.label.trim() === '' && r.valueText.trim() === '');
}
