// The document's own glyphs: import an SVG file as a glyph (cleaned, measured, its geometry warnings
// shown), keep it in the chart document so it travels with it, and use it for the chart.
import { useEffect, useMemo, useState, type ReactElement } from 'react';
import type { Warning } from '../../../shared-core/errors';
import { isTallyError } from '../../../shared-core/errors';
import { measureGlyph } from '../../../shared-core/glyph';
import { importOwnGlyph, ownGlyphName } from '../../../shared-core/glyph/importOwnGlyph';
import type { HostApi } from '../../../shared-core/host';
import type { Action } from '../editor/actions';
import type { EditorDocument } from '../editor/editorDocument';
import { base64ToBytes, decodeSvgText } from '../audit/readSupplied';
import { Icon } from '../components/Icon';
import { ownGlyphImageUrl, setOwnGlyphs } from './ownGlyphImages';
import { FontGlyphPicker } from './FontGlyphPicker';
import type { FontGlyph } from '../../../shared-core/glyph/glyphFromFont';
import './glyphs.css';

interface Props {
  doc: EditorDocument;
  dispatch: (action: Action) => void;
  host: HostApi;
  onNotice: (text: string, tone?: 'info' | 'error') => void;
}

interface LastImport {
  name: string;
  from: string;
  warnings: Warning[];
}

function percent(share: number): string {
  return `${(share * 100).toFixed(share < 0.1 ? 1 : 0)}%`;
}

export function OwnGlyphsPanel({ doc, dispatch, host, onNotice }: Props): ReactElement {
  const [last, setLast] = useState<LastImport | null>(null);
  const [fromFont, setFromFont] = useState(false);
  // Thumbnails elsewhere (the glyph button, row pickers) read the same glyphs; App sets them before
  // rendering its panels, this keeps them right when the panel is used on its own.
  useEffect(() => setOwnGlyphs(doc.glyphs), [doc.glyphs]);

  const entries = useMemo(
    () =>
      Object.entries(doc.glyphs ?? {}).map(([name, glyph]) => {
        let share: number | null;
        try {
          share = measureGlyph(glyph.svg).boxFraction;
        } catch {
          share = null;
        }
        return { name, glyph, share };
      }),
    [doc.glyphs],
  );

  const importSvg = async () => {
    const result = await host.openSupplied({ purpose: 'glyph' });
    if (!result.ok) return onNotice(result.error.message, 'error');
    if (!result.value) return;
    const fileName = result.value.name;
    try {
      const imported = importOwnGlyph(decodeSvgText(base64ToBytes(result.value.base64)));
      const name = ownGlyphName(fileName, Object.keys(doc.glyphs ?? {}));
      dispatch({ type: 'add-own-glyph', name, glyph: { svg: imported.svg, from: fileName.slice(0, 200) } });
      setLast({ name, from: fileName, warnings: imported.warnings });
      onNotice(`Imported ${fileName} as ${name}: its ink fills ${percent(imported.boxFraction)} of its box. It is now the chart's glyph and is saved inside the chart.`);
    } catch (e) {
      onNotice(`Could not use ${fileName} as a glyph: ${isTallyError(e) || e instanceof Error ? e.message : String(e)}`, 'error');
    }
  };

  const addFontGlyph = (glyph: FontGlyph) => {
    const name = ownGlyphName(glyph.glyphName && !/^(uni|u)[0-9a-f]+$/i.test(glyph.glyphName) ? glyph.glyphName : `u${glyph.codePoint.toString(16)}`, Object.keys(doc.glyphs ?? {}));
    dispatch({ type: 'add-own-glyph', name, glyph: { svg: glyph.svg, from: glyph.from.slice(0, 200) } });
    setLast({ name, from: glyph.from, warnings: glyph.warnings });
    onNotice(`Added ${glyph.from} as ${name}: its ink fills ${percent(glyph.boxFraction)} of its box. It is now the chart's glyph.`);
  };

  return (
    <div className="own-glyphs" data-testid="own-glyphs">
      <div className="own-glyph-actions">
        <button type="button" className="button" onClick={() => void importSvg()} data-testid="import-svg-glyph">
          <Icon name="open" /> Import SVG glyph…
        </button>
        <button type="button" className="button" aria-expanded={fromFont} onClick={() => setFromFont(!fromFont)} data-testid="font-glyph">
          From a font character…
        </button>
      </div>
      {fromFont && <FontGlyphPicker host={host} onPick={addFontGlyph} onClose={() => setFromFont(false)} onNotice={onNotice} />}
      {last && last.warnings.length > 0 && (
        <div className="own-glyph-warnings" role="note" data-testid="glyph-warnings">
          <p className="own-glyph-warnings-title">About {last.from}:</p>
          <ul>
            {last.warnings.map((w, i) => (
              <li key={i} data-code={w.code}>
                {w.message}
              </li>
            ))}
          </ul>
        </div>
      )}
      {entries.length === 0 ? (
        <p className="field-hint">Bring in the studio's own icon as SVG. It is cleaned of anything active, measured by its ink like the bundled glyphs, and kept inside the chart document.</p>
      ) : (
        <ul className="own-glyph-list" aria-label="Glyphs kept in this chart">
          {entries.map(({ name, glyph, share }) => {
            const url = ownGlyphImageUrl(name);
            const inUse = doc.encoding.glyph === name;
            return (
              <li key={name} className={inUse ? 'own-glyph in-use' : 'own-glyph'} data-glyph={name}>
                {url ? <img src={url} width={32} height={32} alt="" /> : <span className="glyph-thumb glyph-thumb-missing">?</span>}
                <span className="own-glyph-text">
                  <span className="own-glyph-name">{name.slice(4)}</span>
                  <span className="own-glyph-meta" data-testid="own-glyph-share">
                    {share === null ? 'not measurable' : `ink ${percent(share)} of its box`}
                    {glyph.from ? ` · ${glyph.from}` : ''}
                  </span>
                </span>
                <button type="button" className="link-button" disabled={inUse} onClick={() => dispatch({ type: 'set-glyph', glyph: name })}>
                  {inUse ? 'In use' : 'Use'}
                </button>
                <button type="button" className="icon-button" aria-label={`Remove ${name.slice(4)}`} title="Remove from this chart" onClick={() => dispatch({ type: 'remove-own-glyph', name })}>
                  <Icon name="cross" />
                </button>
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
