// The data table: label, value and an optional glyph and colour per row. Cells keep whatever was typed; a
// problem is shown under its cell and the chart waits until it is fixed.
import { Fragment, useRef, useState, type ClipboardEvent, type ReactElement } from 'react';
import type { Action } from '../editor/actions';
import type { EditorDocument, RowField, RowProblem } from '../editor/editorDocument';
import { looksTabular } from '../editor/parseTable';
import { defaultPalette } from '../demoCharts';
import { ColorSwatch } from './ColorSwatch';
import { GlyphPicker, GlyphThumb } from './GlyphPicker';
import { Icon } from './Icon';

interface DataTableProps {
  doc: EditorDocument;
  problems: RowProblem[];
  dispatch: (action: Action) => void;
  seal: () => void;
  onNotice: (text: string, tone?: 'info' | 'error') => void;
  /** The layout's sentence about category colours (two the same, too many to tell apart), shown under the table. */
  colorNote?: { message: string; refused: boolean } | null;
}

const PALETTE = defaultPalette();

export function DataTable({ doc, problems, dispatch, seal, onNotice, colorNote = null }: DataTableProps): ReactElement {
  // "Automatic" is the colour the layout gives a row without its own: the chart's list (or the palette) by place.
  const listed = doc.layout.colors && doc.layout.colors.length > 0 ? doc.layout.colors : PALETTE;
  const [pickerRow, setPickerRow] = useState<string | null>(null);
  const pickerAnchor = useRef<HTMLButtonElement | null>(null);
  const problemAt = (rowId: string, field: RowField) => problems.find((p) => p.rowId === rowId && p.field === field)?.message;

  const pasteInto = (rowId: string) => (e: ClipboardEvent<HTMLInputElement>) => {
    const text = e.clipboardData.getData('text/plain');
    if (!looksTabular(text)) return;
    e.preventDefault();
    dispatch({ type: 'paste-table', text, atRowId: rowId });
    onNotice('Pasted rows into the table.');
  };

  const pasteWhole = async () => {
    try {
      const text = await navigator.clipboard.readText();
      if (!text.trim()) {
        onNotice('The clipboard holds no text to paste.', 'error');
        return;
      }
      dispatch({ type: 'paste-table', text });
      onNotice('Replaced the table with the pasted rows.');
    } catch {
      onNotice('The browser did not allow reading the clipboard; click a cell and press Ctrl+V (⌘V) instead.', 'error');
    }
  };

  return (
    <div className="data-table-wrap">
      <table className="data-table" aria-label="Chart data">
        <thead>
          <tr>
            <th className="col-index" scope="col">#</th>
            <th scope="col">Label</th>
            <th className="col-value" scope="col">Value</th>
            <th className="col-glyph" scope="col" title="Optional: a glyph for this row only">Glyph</th>
            <th className="col-color" scope="col" title="Optional: a colour for this row only; a dashed swatch is automatic (the chart’s colours in order)">
              <span className="color-head" aria-hidden="true" />
              <span className="sr-only">Colour</span>
            </th>
            <th className="col-actions" scope="col"><span className="sr-only">Row actions</span></th>
          </tr>
        </thead>
        <tbody>
          {doc.rows.map((row, index) => {
            const labelProblem = problemAt(row.id, 'label');
            const valueProblem = problemAt(row.id, 'value');
            const glyphProblem = problemAt(row.id, 'glyph');
            const rowProblem = [labelProblem, valueProblem, glyphProblem].filter(Boolean).join(' ');
            return (
              <Fragment key={row.id}>
              <tr className={rowProblem ? 'has-problem' : undefined} data-row-id={row.id}>
                <td className="col-index">{index + 1}</td>
                <td>
                  <input
                    className="cell-input"
                    value={row.label}
                    aria-label={`Label of row ${index + 1}`}
                    aria-invalid={labelProblem ? true : undefined}
                    onChange={(e) => dispatch({ type: 'edit-label', rowId: row.id, text: e.target.value })}
                    onBlur={seal}
                    onPaste={pasteInto(row.id)}
                  />
                </td>
                <td className="col-value">
                  <input
                    className="cell-input numeric"
                    value={row.valueText}
                    inputMode="decimal"
                    aria-label={`Value of row ${index + 1}`}
                    aria-invalid={valueProblem ? true : undefined}
                    onChange={(e) => dispatch({ type: 'edit-value', rowId: row.id, text: e.target.value })}
                    onBlur={seal}
                    onPaste={pasteInto(row.id)}
                  />
                </td>
                <td className="col-glyph">
                  <button
                    ref={pickerRow === row.id ? pickerAnchor : undefined}
                    type="button"
                    className={row.glyph === undefined ? 'glyph-button inherits' : 'glyph-button'}
                    aria-label={`Glyph of row ${index + 1}: ${typeof row.glyph === 'string' ? row.glyph : row.glyph ? 'custom SVG' : 'the chart’s glyph'}`}
                    aria-invalid={glyphProblem ? true : undefined}
                    title={typeof row.glyph === 'string' ? row.glyph : 'Same as the chart'}
                    onClick={() => setPickerRow(pickerRow === row.id ? null : row.id)}
                  >
                    {row.glyph === undefined ? <GlyphThumb glyph={doc.encoding.glyph} size={18} /> : <GlyphThumb glyph={row.glyph} size={18} />}
                  </button>
                  {pickerRow === row.id && (
                    <GlyphPicker
                      label={`Glyph for ${row.label || `row ${index + 1}`}`}
                      anchor={pickerAnchor}
                      value={row.glyph}
                      onChoose={(name) => {
                        dispatch({ type: 'set-row-glyph', rowId: row.id, glyph: name });
                        setPickerRow(null);
                      }}
                      onClear={() => {
                        dispatch({ type: 'set-row-glyph', rowId: row.id, glyph: null });
                        setPickerRow(null);
                      }}
                      onClose={() => setPickerRow(null)}
                    />
                  )}
                </td>
                <td className="col-color">
                  <div className="row-color">
                    <ColorSwatch
                      color={row.color ?? listed[index % listed.length]}
                      automatic={row.color === undefined}
                      label={`Colour of row ${index + 1}: ${row.color === undefined ? `automatic (${listed[index % listed.length]})` : row.color}`}
                      onPick={(color) => dispatch({ type: 'set-row-color', rowId: row.id, color, typing: true })}
                      onDone={seal}
                      testId={`row-color-${index + 1}`}
                    />
                    {row.color !== undefined && (
                      <button type="button" className="icon-button color-reset" aria-label={`Colour of row ${index + 1} back to automatic`} title="Back to automatic" onClick={() => dispatch({ type: 'set-row-color', rowId: row.id, color: null })}>
                        <Icon name="cross" size={10} />
                      </button>
                    )}
                  </div>
                </td>
                <td className="col-actions">
                  <div className="row-actions">
                    <button type="button" className="icon-button" aria-label={`Move row ${index + 1} up`} title="Move up" disabled={index === 0} onClick={() => dispatch({ type: 'move-row', rowId: row.id, by: -1 })}>
                      <Icon name="up" size={14} />
                    </button>
                    <button type="button" className="icon-button" aria-label={`Move row ${index + 1} down`} title="Move down" disabled={index === doc.rows.length - 1} onClick={() => dispatch({ type: 'move-row', rowId: row.id, by: 1 })}>
                      <Icon name="down" size={14} />
                    </button>
                    <button type="button" className="icon-button danger" aria-label={`Remove row ${index + 1}`} title="Remove row" onClick={() => dispatch({ type: 'remove-row', rowId: row.id })}>
                      <Icon name="cross" size={14} />
                    </button>
                  </div>
                </td>
              </tr>
              {rowProblem && (
                <tr className="problem-row">
                  <td />
                  <td colSpan={5}>
                    <p className="cell-problem" role="alert" data-testid={`problem-${row.id}`}>
                      {rowProblem}
                    </p>
                  </td>
                </tr>
              )}
              </Fragment>
            );
          })}
        </tbody>
      </table>
      {colorNote && (
        <p className={colorNote.refused ? 'field-problem color-note' : 'field-problem color-note warn'} role={colorNote.refused ? 'alert' : 'status'} data-testid="color-note">
          {colorNote.message}
        </p>
      )}
      <div className="table-tools">
        <button type="button" className="button subtle" onClick={() => dispatch({ type: 'add-row' })}>
          <Icon name="plus" size={14} /> Add row
        </button>
        <button type="button" className="button subtle" onClick={pasteWhole} title="Replace the table with rows copied from a spreadsheet or a CSV/TSV file">
          <Icon name="paste" size={14} /> Paste table
        </button>
        <span className="muted tools-hint">Paste into a cell to fill rows from there.</span>
      </div>
    </div>
  );
}
