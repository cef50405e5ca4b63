// The words on the chart: which labels show, their place and alignment, the value labels' unit, the
// font, the title and source sizes, and the key's wording. Each applies as it is typed and is one undo
// step per visit; what the document check refuses is said under its field.
import type { ReactElement } from 'react';
import {
  KEY_WORDING_AMOUNT,
  KEY_WORDING_MAX,
  KEY_WORDING_UNIT,
  LABEL_ALIGNS,
  LABEL_POSITIONS,
  SOURCE_SIZE_PT_RANGE,
  TEXT_FONTS,
  TITLE_SIZE_PT_RANGE,
  VALUE_UNIT_MAX,
  type LabelAlign,
  type LabelPosition,
  type TextFont,
} from '../../../shared-core/document';
import { TEXT_SIZE_MM } from '../../../shared-core/layout';
import type { Action } from '../editor/actions';
import type { EditorDocument } from '../editor/editorDocument';
import { NumberField } from './NumberField';
import { RadioGroup, type RadioOption } from './RadioGroup';

/** CSS absolute units: 1 pt = 1/72 in = 25.4/72 mm. */
const PT_PER_MM = 72 / 25.4;
const DEFAULT_TITLE_PT = Number((TEXT_SIZE_MM.title * PT_PER_MM).toFixed(1));
const DEFAULT_SOURCE_PT = Number((TEXT_SIZE_MM.source * PT_PER_MM).toFixed(1));

const FONT_WORDS: Record<string, string> = { sans: 'Sans-serif', serif: 'Serif' };
const FONTS: readonly RadioOption<TextFont>[] = TEXT_FONTS.map((f) => ({ value: f, label: FONT_WORDS[f] ?? f }));
const POSITION_WORDS: Record<LabelPosition, string> = { beside: 'Beside the glyphs', above: 'Above the glyphs' };
const POSITIONS: readonly RadioOption<LabelPosition>[] = LABEL_POSITIONS.map((p) => ({ value: p, label: POSITION_WORDS[p] ?? p }));
const ALIGN_WORDS: Record<LabelAlign, string> = { start: 'Flush left', end: 'Flush right' };
const ALIGNS: readonly RadioOption<LabelAlign>[] = LABEL_ALIGNS.map((a) => ({ value: a, label: ALIGN_WORDS[a] ?? a }));

interface TypeLabelsPanelProps {
  doc: EditorDocument;
  dispatch: (action: Action) => void;
  seal: () => void;
  /** The document check's problems (path and sentence), shown under the field they name. */
  problems?: readonly { path: string; message: string }[];
}

function characters(text: string): number {
  return [...text].length;
}

export function TypeLabelsPanel({ doc, dispatch, seal, problems = [] }: TypeLabelsPanelProps): ReactElement {
  const layout = doc.layout;
  const problemAt = (field: string) => problems.find((p) => p.path === `layout.${field}`)?.message ?? null;
  const position = layout.labelPosition ?? 'beside';
  // Absent, the layout sets labels flush left (shared-core repeatLayout), beside or above.
  const align = layout.labelAlign ?? 'start';
  const valueUnit = layout.valueUnit ?? '';
  const keyWording = layout.keyWording ?? '';
  const counted = doc.encoding.mode === 'repeat' || doc.encoding.mode === 'stack';
  const rowsOfTheirOwn = doc.encoding.mode === 'repeat' && doc.encoding.arrangement === 'per-category';

  const valueUnitProblem =
    characters(valueUnit) > VALUE_UNIT_MAX ? `At most ${VALUE_UNIT_MAX} characters, such as “L” or “kWh”.` : problemAt('valueUnit') ? `The unit ${problemAt('valueUnit')}.` : null;
  const keyProblem =
    keyWording === ''
      ? null
      : !keyWording.includes(KEY_WORDING_AMOUNT)
        ? `The key must say what one glyph stands for: put ${KEY_WORDING_AMOUNT} where that amount goes (for example “Each glyph = ${KEY_WORDING_AMOUNT} ${KEY_WORDING_UNIT}”).`
        : characters(keyWording) > KEY_WORDING_MAX
          ? `At most ${KEY_WORDING_MAX} characters.`
          : problemAt('keyWording') ? `The key wording ${problemAt('keyWording')}.` : null;
  const insert = (placeholder: string) => dispatch({ type: 'set-key-wording', keyWording: keyWording === '' ? placeholder : `${keyWording}${/\s$/.test(keyWording) ? '' : ' '}${placeholder}` });

  return (
    <div className="type-labels-panel">
      <div className="field">
        <span className="field-label">Show</span>
        <div className="checks">
          <label className="check">
            <input type="checkbox" checked={layout.labels} data-testid="show-labels" onChange={(e) => dispatch({ type: 'set-show', what: 'labels', on: e.target.checked })} /> Category labels
          </label>
          <label className="check">
            <input type="checkbox" checked={layout.valueLabels} data-testid="show-values" onChange={(e) => dispatch({ type: 'set-show', what: 'valueLabels', on: e.target.checked })} /> Values
          </label>
          <label className="check">
            <input type="checkbox" checked={layout.legend} data-testid="show-key" onChange={(e) => dispatch({ type: 'set-show', what: 'legend', on: e.target.checked })} /> Key
          </label>
        </div>
      </div>

      {/* Labels sit beside or above their row only where each category has a row of its own. */}
      {layout.labels && rowsOfTheirOwn && (
        <div className="field">
          <span className="field-label" id="label-position-label">Category labels</span>
          <RadioGroup labelledBy="label-position-label" options={POSITIONS} value={position} onChange={(labelPosition) => dispatch({ type: 'set-label-position', labelPosition })} testId="label-position-group" />
        </div>
      )}
      {layout.labels && rowsOfTheirOwn && (
        <div className="field">
          <span className="field-label" id="label-align-label">Label alignment</span>
          <RadioGroup labelledBy="label-align-label" options={ALIGNS} value={align} onChange={(labelAlign) => dispatch({ type: 'set-label-align', labelAlign })} testId="label-align-group" />
        </div>
      )}

      {layout.valueLabels && (
        <div className="field">
          <label htmlFor="value-unit">Unit after values</label>
          <input
            id="value-unit"
            value={valueUnit}
            placeholder="e.g. L, kWh, people"
            data-testid="value-unit"
            aria-invalid={valueUnitProblem ? true : undefined}
            aria-describedby="value-unit-note"
            onChange={(e) => dispatch({ type: 'set-value-unit', valueUnit: e.target.value })}
            onBlur={seal}
          />
          {valueUnitProblem ? (
            <p className="field-problem" id="value-unit-note" role="alert">{valueUnitProblem}</p>
          ) : (
            <p className="field-hint" id="value-unit-note">{valueUnit ? `A value of 12 reads “12 ${valueUnit}”.` : 'Empty: values are written as plain numbers.'}</p>
          )}
        </div>
      )}

      <div className="field">
        <span className="field-label" id="font-label">Font</span>
        <RadioGroup labelledBy="font-label" options={FONTS} value={layout.font ?? 'sans'} onChange={(font) => dispatch({ type: 'set-font', font })} testId="font-group" />
        <p className="field-hint">Bundled open-licence fonts; text is written as outlines, so the file looks the same everywhere.</p>
      </div>

      <div className="field-row align-end">
        <NumberField
          label="Title size"
          value={layout.titleSizePt ?? DEFAULT_TITLE_PT}
          suffix="pt"
          testId="title-size"
          check={(v) => (v >= TITLE_SIZE_PT_RANGE.min && v <= TITLE_SIZE_PT_RANGE.max ? null : `From ${TITLE_SIZE_PT_RANGE.min} to ${TITLE_SIZE_PT_RANGE.max} pt.`)}
          live
          onCommit={(v) => dispatch({ type: 'set-title-size', sizePt: v, typing: true })}
          onDone={seal}
          hint={layout.titleSizePt === undefined ? 'The standard size.' : undefined}
        />
        <NumberField
          label="Source size"
          value={layout.sourceSizePt ?? DEFAULT_SOURCE_PT}
          suffix="pt"
          testId="source-size"
          check={(v) => (v >= SOURCE_SIZE_PT_RANGE.min && v <= SOURCE_SIZE_PT_RANGE.max ? null : `From ${SOURCE_SIZE_PT_RANGE.min} to ${SOURCE_SIZE_PT_RANGE.max} pt.`)}
          live
          onCommit={(v) => dispatch({ type: 'set-source-size', sizePt: v, typing: true })}
          onDone={seal}
          hint={layout.sourceSizePt === undefined ? 'The standard size.' : undefined}
        />
      </div>
      {(layout.titleSizePt !== undefined || layout.sourceSizePt !== undefined) && (
        <div className="inline-buttons">
          {layout.titleSizePt !== undefined && (
            <button type="button" className="link-button" onClick={() => dispatch({ type: 'set-title-size', sizePt: null })}>
              Standard title size
            </button>
          )}
          {layout.sourceSizePt !== undefined && (
            <button type="button" className="link-button" onClick={() => dispatch({ type: 'set-source-size', sizePt: null })}>
              Standard source size
            </button>
          )}
        </div>
      )}

      {layout.legend && counted && (
        <div className="field">
          <div className="field-label-row">
            <label htmlFor="key-wording">Key wording</label>
            <span className="inline-buttons">
              <button type="button" className="link-button" onClick={() => insert(KEY_WORDING_AMOUNT)}>+ {KEY_WORDING_AMOUNT}</button>
              <button type="button" className="link-button" onClick={() => insert(KEY_WORDING_UNIT)}>+ {KEY_WORDING_UNIT}</button>
            </span>
          </div>
          <input
            id="key-wording"
            value={keyWording}
            placeholder={`one glyph = ${KEY_WORDING_AMOUNT} ${KEY_WORDING_UNIT}`}
            data-testid="key-wording"
            aria-invalid={keyProblem ? true : undefined}
            aria-describedby="key-wording-note"
            onChange={(e) => dispatch({ type: 'set-key-wording', keyWording: e.target.value })}
            onBlur={seal}
          />
          {keyProblem ? (
            <p className="field-problem" id="key-wording-note" role="alert" data-testid="key-wording-problem">{keyProblem}</p>
          ) : (
            <p className="field-hint" id="key-wording-note">
              {KEY_WORDING_AMOUNT} becomes what one glyph stands for and {KEY_WORDING_UNIT} what is counted, both taken from the chart, so the key always states the real unit. Empty: the standard wording.
            </p>
          )}
        </div>
      )}
    </div>
  );
}
