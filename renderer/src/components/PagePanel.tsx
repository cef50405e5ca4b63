// Page size in mm or inches, margins and bleed (margins and bleed are always in mm, as printers give them).
import type { ReactElement } from 'react';
import { PAGE_UNIT_MM, type PageUnit } from '../../../shared-core/document';
import type { Action } from '../editor/actions';
import type { EditorDocument } from '../editor/editorDocument';
import { ColorSwatch } from './ColorSwatch';
import { Icon } from './Icon';
import { NumberField } from './NumberField';

/** Sheet sizes in mm: ISO 216 (A series) and ANSI Letter (8.5 x 11 in). */
const SHEETS: { name: string; widthMm: number; heightMm: number }[] = [
  { name: 'A5', widthMm: 148, heightMm: 210 },
  { name: 'A4', widthMm: 210, heightMm: 297 },
  { name: 'A3', widthMm: 297, heightMm: 420 },
  { name: 'Letter', widthMm: 215.9, heightMm: 279.4 },
];

/** A warm paper white: light enough that text keeps well over 4.5:1 (WCAG 2.1) against it. */
const DEFAULT_BACKGROUND = '#fbf8f1';

const UNIT_NAMES: Record<PageUnit, string> = { mm: 'mm', in: 'in', pt: 'pt', px: 'px' };

interface PagePanelProps {
  doc: EditorDocument;
  dispatch: (action: Action) => void;
  /** Ends a colour drag's undo step. */
  seal?: () => void;
}

function sheetName(widthMm: number, heightMm: number): string {
  for (const s of SHEETS) {
    if (Math.abs(s.widthMm - widthMm) < 0.5 && Math.abs(s.heightMm - heightMm) < 0.5) return `${s.name} portrait`;
    if (Math.abs(s.heightMm - widthMm) < 0.5 && Math.abs(s.widthMm - heightMm) < 0.5) return `${s.name} landscape`;
  }
  return 'custom';
}

export function PagePanel({ doc, dispatch, seal = () => undefined }: PagePanelProps): ReactElement {
  const { width, height, unit } = doc.page;
  const perUnit = PAGE_UNIT_MM[unit];
  const widthMm = width * perUnit;
  const heightMm = height * perUnit;
  const m = doc.layout.margins;
  const units: PageUnit[] = unit === 'mm' || unit === 'in' ? ['mm', 'in'] : ['mm', 'in', unit];
  const positive = (v: number) => (v > 0 ? null : 'Must be greater than 0.');
  const margin = (v: number) => (v >= 0 ? null : 'Must be 0 or more.');
  const decimals = unit === 'in' ? 3 : 2;

  const applySheet = (name: string) => {
    const [sheet, orientation] = name.split(' ');
    const s = SHEETS.find((x) => x.name === sheet);
    if (!s) return;
    const [wMm, hMm] = orientation === 'landscape' ? [s.heightMm, s.widthMm] : [s.widthMm, s.heightMm];
    dispatch({ type: 'set-page-size', width: Number((wMm / perUnit).toFixed(decimals)), height: Number((hMm / perUnit).toFixed(decimals)) });
  };

  const current = sheetName(widthMm, heightMm);
  const background = doc.layout.background;

  return (
    <div className="page-panel">
      <div className="field-row">
        <div className="field">
          <label htmlFor="page-sheet">Sheet</label>
          <select id="page-sheet" value={current} onChange={(e) => applySheet(e.target.value)}>
            {current === 'custom' && <option value="custom">Custom size</option>}
            {SHEETS.flatMap((s) => [
              <option key={`${s.name}p`} value={`${s.name} portrait`}>{s.name} portrait</option>,
              <option key={`${s.name}l`} value={`${s.name} landscape`}>{s.name} landscape</option>,
            ])}
          </select>
        </div>
        <div className="field narrow-field">
          <label htmlFor="page-unit">Unit</label>
          <select id="page-unit" value={unit} onChange={(e) => dispatch({ type: 'set-page-unit', unit: e.target.value as PageUnit })} data-testid="page-unit">
            {units.map((u) => (
              <option key={u} value={u}>{UNIT_NAMES[u]}</option>
            ))}
          </select>
        </div>
      </div>
      <div className="field-row align-end">
        <NumberField label="Width" value={width} suffix={UNIT_NAMES[unit]} check={positive} testId="page-width" onCommit={(v) => dispatch({ type: 'set-page-size', width: v, height })} />
        <button type="button" className="icon-button swap" title="Swap width and height" aria-label="Swap width and height" onClick={() => dispatch({ type: 'set-page-size', width: height, height: width })}>
          <Icon name="swap" size={14} />
        </button>
        <NumberField label="Height" value={height} suffix={UNIT_NAMES[unit]} check={positive} testId="page-height" onCommit={(v) => dispatch({ type: 'set-page-size', width, height: v })} />
      </div>
      <div className="field">
        <span className="field-label">Margins</span>
        <div className="margin-grid">
          <NumberField label="Top" value={m.top} suffix="mm" check={margin} width="narrow" onCommit={(v) => dispatch({ type: 'set-margins', margins: { ...m, top: v } })} />
          <NumberField label="Right" value={m.right} suffix="mm" check={margin} width="narrow" onCommit={(v) => dispatch({ type: 'set-margins', margins: { ...m, right: v } })} />
          <NumberField label="Bottom" value={m.bottom} suffix="mm" check={margin} width="narrow" onCommit={(v) => dispatch({ type: 'set-margins', margins: { ...m, bottom: v } })} />
          <NumberField label="Left" value={m.left} suffix="mm" check={margin} width="narrow" onCommit={(v) => dispatch({ type: 'set-margins', margins: { ...m, left: v } })} />
        </div>
      </div>
      <div className="field-row align-end">
        <NumberField
          label="Bleed"
          value={doc.layout.bleedMm}
          suffix="mm"
          check={margin}
          testId="page-bleed"
          hint="Printers commonly ask for 3 mm."
          onCommit={(v) => dispatch({ type: 'set-bleed', bleedMm: v })}
        />
      </div>
      <div className="field-row align-end">
        <div className="field">
          <label htmlFor="page-background-on">
            <input
              id="page-background-on"
              type="checkbox"
              checked={background !== undefined}
              data-testid="page-background-on"
              onChange={(e) => dispatch({ type: 'set-background', background: e.target.checked ? DEFAULT_BACKGROUND : null })}
            />{' '}
            Background
          </label>
          <span className="field-hint">{background === undefined ? 'None: the page stays transparent in SVG and PNG.' : 'Painted to the bleed edge.'}</span>
        </div>
        {background !== undefined && (
          <div className="field narrow-field">
            <span className="field-label">Colour</span>
            <ColorSwatch
              color={background}
              label="Background colour"
              testId="page-background"
              onPick={(color) => dispatch({ type: 'set-background', background: color, typing: true })}
              onDone={seal}
            />
          </div>
        )}
      </div>
    </div>
  );
}
