// How big the glyphs are, how far apart, how many to a row, which way they are read. Only the settings
// the current mode uses are shown; each applies as it is typed and is one undo step per visit.
import type { ReactElement } from 'react';
import { GROUP_EVERY_CHOICES, SORT_ORDERS, type Direction, type GroupEvery, type SortOrder } from '../../../shared-core/document';
import type { Action } from '../editor/actions';
import type { EditorDocument } from '../editor/editorDocument';
import { NumberField } from './NumberField';
import { RadioGroup, type RadioOption } from './RadioGroup';

/** A size the designer asks for when switching off "automatic": a common icon size, refined by typing. */
const FIRST_GLYPH_SIZE_MM = 8;
const FIRST_COLUMNS = 10;

const REPEAT_DIRECTIONS: readonly RadioOption<Direction>[] = [
  { value: 'ltr', label: 'Left to right', title: 'Glyphs fill each row from the left; a partial glyph is cut on its right side.' },
  { value: 'rtl', label: 'Right to left', title: 'Glyphs fill each row from the right, for charts read right to left.' },
  { value: 'btt', label: 'Bottom up', title: 'Rows fill from the bottom; a partial glyph is cut from below.' },
];

/** Fill reads "left to right" as rising from the bottom, like a level (shared-core fillDirection). */
const FILL_DIRECTIONS: readonly RadioOption<Direction>[] = [
  { value: 'btt', label: 'Rises from the bottom' },
  { value: 'rtl', label: 'From the right' },
];

const GROUP_WORDS: Record<GroupEvery, string> = { 0: 'Even', 5: 'In fives', 10: 'In tens' };
const GROUPS: readonly RadioOption<`${GroupEvery}`>[] = GROUP_EVERY_CHOICES.map((n) => ({ value: `${n}`, label: GROUP_WORDS[n] ?? `In ${n}s` }));

const SORT_WORDS: Record<SortOrder, string> = { given: 'As in the table', descending: 'Largest first', ascending: 'Smallest first' };
const SORTS: readonly RadioOption<SortOrder>[] = SORT_ORDERS.map((o) => ({ value: o, label: SORT_WORDS[o] ?? o }));

interface SizeOrderPanelProps {
  doc: EditorDocument;
  dispatch: (action: Action) => void;
  seal: () => void;
}

export function SizeOrderPanel({ doc, dispatch, seal }: SizeOrderPanelProps): ReactElement {
  const mode = doc.encoding.mode;
  const layout = doc.layout;
  const autoSize = layout.glyphSizeMm === undefined;
  const autoColumns = layout.columns === 'auto';
  const usesGap = mode === 'repeat' || mode === 'stack';
  const usesColumns = mode !== 'stack';
  const directions = mode === 'repeat' ? REPEAT_DIRECTIONS : mode === 'fill' ? FILL_DIRECTIONS : null;
  const direction = mode === 'fill' ? (layout.direction === 'rtl' ? 'rtl' : 'btt') : layout.direction;
  const perRowName = 'Glyphs per row';
  const sizeName = mode === 'scale' ? 'Largest glyph' : 'Glyph size';

  return (
    <div className="size-order-panel">
      <div className="field">
        <label className="check corner">
          <input type="checkbox" checked={autoSize} aria-label={`${sizeName}: automatic`} data-testid="glyph-size-auto" onChange={(e) => dispatch({ type: 'set-glyph-size', glyphSizeMm: e.target.checked ? null : FIRST_GLYPH_SIZE_MM })} />
          Automatic
        </label>
        {autoSize ? (
          <div className="field number-field normal">
            <span className="field-label">{sizeName}</span>
            <p className="readout" data-testid="glyph-size-readout">The largest that fits the page</p>
          </div>
        ) : (
          <NumberField
            label={sizeName}
            value={layout.glyphSizeMm ?? FIRST_GLYPH_SIZE_MM}
            suffix="mm"
            testId="glyph-size"
            check={(v) => (v > 0 ? null : 'The size must be greater than 0 mm.')}
            live
            onCommit={(v) => dispatch({ type: 'set-glyph-size', glyphSizeMm: v, typing: true })}
            onDone={seal}
            hint={mode === 'scale' ? 'The longer side of the largest glyph’s ink.' : 'The longer side of a glyph’s ink; shrunk, with a note, when it does not fit.'}
          />
        )}
      </div>

      {(usesGap || usesColumns) && (
        <div className="field-row align-end">
          {usesGap && (
            <NumberField
              label="Gap"
              value={Number((layout.gapRatio * 100).toFixed(4))}
              suffix="%"
              testId="glyph-gap"
              check={(v) => (v >= 0 && v <= 1000 ? null : 'From 0 to 1000% of the glyph size.')}
              live
              onCommit={(v) => dispatch({ type: 'set-gap', gapRatio: v / 100, typing: true })}
              onDone={seal}
              hint="Of the glyph size."
            />
          )}
          {usesColumns && (
            <div className="field">
              <label className="check corner">
                <input type="checkbox" checked={autoColumns} aria-label={`${perRowName}: automatic`} data-testid="columns-auto" onChange={(e) => dispatch({ type: 'set-columns', columns: e.target.checked ? 'auto' : FIRST_COLUMNS })} />
                Auto
              </label>
              {autoColumns ? (
                <div className="field number-field normal">
                  <span className="field-label">{perRowName}</span>
                  <p className="readout">As many as fit</p>
                </div>
              ) : (
                <NumberField
                  label={perRowName}
                  value={layout.columns === 'auto' ? FIRST_COLUMNS : layout.columns}
                  testId="columns"
                  check={(v) => (Number.isInteger(v) && v >= 1 ? null : 'A whole number, 1 or more.')}
                  live
                  onCommit={(v) => dispatch({ type: 'set-columns', columns: v, typing: true })}
                  onDone={seal}
                />
              )}
            </div>
          )}
        </div>
      )}

      {usesGap && (
        <div className="field">
          <span className="field-label" id="group-label">Grouping</span>
          <RadioGroup
            labelledBy="group-label"
            options={GROUPS}
            value={`${layout.groupEvery ?? 0}`}
            onChange={(v) => dispatch({ type: 'set-group-every', groupEvery: Number(v) as GroupEvery })}
            testId="group-group"
          />
          <p className="field-hint">{mode === 'stack' ? 'A wider gap after every five or ten glyphs of a column' : 'A wider gap after every five or ten glyphs of a row'}, so counts read at a glance.</p>
        </div>
      )}

      <div className="field">
        <span className="field-label" id="sort-label">Order on the chart</span>
        <RadioGroup labelledBy="sort-label" options={SORTS} value={layout.sort ?? 'given'} onChange={(sort) => dispatch({ type: 'set-sort', sort })} testId="sort-group" />
        <p className="field-hint">Reorders the chart only: the table keeps your order.</p>
      </div>

      {directions && (
        <div className="field">
          <span className="field-label" id="direction-label">Reading direction</span>
          <RadioGroup labelledBy="direction-label" options={directions} value={direction} onChange={(d) => dispatch({ type: 'set-direction', direction: d })} testId="direction-group" />
        </div>
      )}
    </div>
  );
}
