// How the numbers become glyphs: mode, what one glyph stands for, the glyph, rounding and colours.
// (Which labels show is in TypeLabelsPanel; size, gap and direction in SizeOrderPanel.)
import { useRef, useState, type ReactElement } from 'react';
import type { Arrangement, EncodingMode, FillTo, Rounding } from '../../../shared-core/document';
import type { Action } from '../editor/actions';
import type { EditorDocument } from '../editor/editorDocument';
import { formatNumber, nearGlyphNames } from '../editor/editorDocument';
import { ColorSwatch } from './ColorSwatch';
import { GlyphPicker, GlyphThumb } from './GlyphPicker';
import { NumberField } from './NumberField';
import { RadioGroup, type RadioOption } from './RadioGroup';

const MODES: { mode: EncodingMode; name: string; says: string }[] = [
  { mode: 'repeat', name: 'Repeat', says: 'Rows of glyphs; each glyph is a fixed amount.' },
  { mode: 'stack', name: 'Stack', says: 'Columns of glyphs rising from one baseline.' },
  { mode: 'scale', name: 'Scale', says: 'One glyph per row, its ink area in proportion to the value.' },
  { mode: 'fill', name: 'Fill', says: 'Each glyph filled by ink to its share.' },
];

const ROUNDINGS: readonly RadioOption<Rounding>[] = [
  { value: 'ink-cut', label: 'Cut by ink' },
  { value: 'whole', label: 'Whole glyphs' },
];

const ARRANGEMENTS: readonly RadioOption<Arrangement>[] = [
  { value: 'per-category', label: 'A row per category' },
  { value: 'shared-grid', label: 'One shared grid' },
];

const FILL_TOS: readonly RadioOption<FillTo>[] = [
  { value: 'max', label: 'The largest value' },
  { value: 'share', label: 'Each value is a share (0–1)' },
];

interface DrawingPanelProps {
  doc: EditorDocument;
  dispatch: (action: Action) => void;
  seal: () => void;
  /** The unit the layout picked when the document leaves it automatic. */
  chosenUnit: number | null;
  defaultColors: string[];
}

export function DrawingPanel({ doc, dispatch, seal, chosenUnit, defaultColors }: DrawingPanelProps): ReactElement {
  const [picking, setPicking] = useState(false);
  const glyphButton = useRef<HTMLButtonElement>(null);
  const enc = doc.encoding;
  const counted = enc.mode === 'repeat' || enc.mode === 'stack';
  const automatic = enc.unit === undefined;
  const colors = doc.layout.colors ?? defaultColors;
  const customColors = doc.layout.colors !== undefined;
  const modeInfo = MODES.find((m) => m.mode === enc.mode);
  const nearNames = nearGlyphNames(enc.glyph);

  return (
    <div className="drawing-panel">
      <div className="field">
        <span className="field-label" id="mode-label">Mode</span>
        <RadioGroup labelledBy="mode-label" options={MODES.map((m) => ({ value: m.mode, label: m.name, title: m.says }))} value={enc.mode} onChange={(mode) => dispatch({ type: 'set-mode', mode })} testId="mode-group" />
        {modeInfo && <p className="field-hint">{modeInfo.says}</p>}
      </div>

      <div className="field glyph-field">
        <span className="field-label">Glyph</span>
        <div className="glyph-choice">
          <button ref={glyphButton} type="button" className="glyph-current" onClick={() => setPicking(!picking)} aria-haspopup="dialog" aria-expanded={picking} data-testid="chart-glyph">
            <GlyphThumb glyph={enc.glyph} size={28} />
            <span className="glyph-current-name">{typeof enc.glyph === 'string' ? enc.glyph : 'custom SVG'}</span>
            <span className="glyph-current-action">Change…</span>
          </button>
          {picking && (
            <GlyphPicker
              label="Chart glyph"
              anchor={glyphButton}
              value={enc.glyph}
              onChoose={(name) => {
                dispatch({ type: 'set-glyph', glyph: name });
                setPicking(false);
              }}
              onClose={() => setPicking(false)}
            />
          )}
        </div>
      </div>

      {nearNames.length > 0 && typeof enc.glyph === 'string' && (
        <div className="field-problem glyph-unknown" role="alert" data-testid="glyph-unknown">
          <p>
            The glyph “{enc.glyph.length > 40 ? `${enc.glyph.slice(0, 40)}…` : enc.glyph}” is unknown: it is not one of the bundled glyphs. Near names:
          </p>
          <div className="near-names">
            {nearNames.map((name) => (
              <button key={name} type="button" className="button subtle near-name" onClick={() => dispatch({ type: 'set-glyph', glyph: name })}>
                <GlyphThumb glyph={name} size={16} /> {name}
              </button>
            ))}
          </div>
        </div>
      )}

      {counted && (
        <div className="field-group">
          <div className="field">
            <span className="field-label">One glyph stands for</span>
            <label className="check corner">
              <input type="checkbox" checked={automatic} onChange={(e) => dispatch({ type: 'set-unit', unit: e.target.checked ? null : (chosenUnit ?? 1) })} data-testid="unit-automatic" />
              Choose automatically
            </label>
          </div>
          <div className="field-row">
            {automatic ? (
              <div className="field number-field normal">
                <label>Amount</label>
                <p className="readout" data-testid="unit-readout">{chosenUnit !== null ? formatNumber(chosenUnit) : '…'}</p>
              </div>
            ) : (
              <NumberField label="Amount" value={enc.unit ?? 1} testId="unit-input" check={(v) => (v > 0 ? null : 'The amount must be greater than 0.')} onCommit={(v) => dispatch({ type: 'set-unit', unit: v, typing: true })} live onDone={seal} />
            )}
            <div className="field">
              <label htmlFor="unit-name">Counting</label>
              <input id="unit-name" value={enc.unitName ?? ''} placeholder="e.g. rides" onChange={(e) => dispatch({ type: 'set-unit-name', unitName: e.target.value })} onBlur={seal} />
            </div>
          </div>
          <div className="field">
            <span className="field-label" id="rounding-label">Remainders</span>
            <RadioGroup labelledBy="rounding-label" options={ROUNDINGS} value={enc.rounding} onChange={(rounding) => dispatch({ type: 'set-rounding', rounding })} testId="rounding-group" />
            <p className="field-hint">
              {enc.rounding === 'ink-cut' ? 'A remainder of 0.4 shows 40% of a glyph’s ink.' : 'Each row is rounded to the nearest whole glyph; the check tells you what that costs.'}
            </p>
          </div>
        </div>
      )}

      {enc.mode === 'repeat' && (
        <div className="field">
          <span className="field-label" id="arrangement-label">Arrangement</span>
          <RadioGroup labelledBy="arrangement-label" options={ARRANGEMENTS} value={enc.arrangement} onChange={(arrangement) => dispatch({ type: 'set-arrangement', arrangement })} testId="arrangement-group" />
        </div>
      )}

      {enc.mode === 'fill' && (
        <div className="field">
          <span className="field-label" id="fill-label">Full glyph means</span>
          <RadioGroup labelledBy="fill-label" options={FILL_TOS} value={enc.fillTo} onChange={(fillTo) => dispatch({ type: 'set-fill-to', fillTo })} testId="fill-group" />
        </div>
      )}

      <div className="field">
        <div className="field-label-row">
          <span className="field-label">Colours</span>
          {customColors && (
            <button type="button" className="link-button" onClick={() => dispatch({ type: 'set-colors', colors: null })}>
              Back to default
            </button>
          )}
        </div>
        <div className="swatches">
          {colors.map((c, i) => (
            <ColorSwatch
              key={i}
              color={c}
              label={`Colour ${i + 1}`}
              onPick={(color) => {
                const next = [...colors];
                next[i] = color;
                dispatch({ type: 'set-colors', colors: next, typing: true });
              }}
              onDone={seal}
            />
          ))}
        </div>
        <p className="field-hint">Colours go to categories in order. Marks print opaque.</p>
      </div>

    </div>
  );
}
