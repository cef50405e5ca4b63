// A glyph from one character of a font: the bundled symbol font (loaded on first use) or a TTF, OTF
// or WOFF file the designer opens. Suggested symbols are shown as their own outlines; any other
// character can be typed, or given by its code (U+2713).
import { useEffect, useMemo, useState, type ReactElement } from 'react';
import type { Font } from 'opentype.js';
import { isTallyError } from '../../../shared-core/errors';
import { characterOutlineSvg, codePointLabel, fontFamilyName, fontHasCharacter, glyphFromFont, parseCharacter, readFont, type FontGlyph } from '../../../shared-core/glyph/glyphFromFont';
import type { HostApi } from '../../../shared-core/host';
import { base64ToBytes } from '../audit/readSupplied';

/** Symbols a chart often wants: checks, boxes, dots, stars, hearts, card suits, weather, travel. */
const SUGGESTED = [...'✓✔■□●○★☆♥♦♣♠☂☕☀☁⚡✈☎✂▲◆✚⬤'].map((c) => c.codePointAt(0) as number);
/** For a user's font, letters and digits are offered too: a text font has few symbols. */
const LETTERS = [...'ABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789'].map((c) => c.codePointAt(0) as number);
const BUNDLED_LABEL = 'Noto Sans Symbols 2';

interface LoadedFont {
  font: Font;
  label: string;
  bundled: boolean;
}

let bundled: Promise<LoadedFont> | null = null;

function loadBundledFont(): Promise<LoadedFont> {
  bundled ??= import('../../../assets/fonts/noto-sans-symbols-2-symbols-400.woff?inline').then((m) => {
    const base64 = m.default.slice(m.default.indexOf(',') + 1);
    return { font: readFont(base64ToBytes(base64)), label: BUNDLED_LABEL, bundled: true };
  });
  return bundled;
}

function messageOf(e: unknown): string {
  return isTallyError(e) || e instanceof Error ? e.message : String(e);
}

export function FontGlyphPicker({ host, onPick, onClose, onNotice }: { host: HostApi; onPick: (glyph: FontGlyph) => void; onClose: () => void; onNotice: (text: string, tone?: 'info' | 'error') => void }): ReactElement {
  const [font, setFont] = useState<LoadedFont | null>(null);
  const [typed, setTyped] = useState('');
  const [problem, setProblem] = useState<string | null>(null);

  useEffect(() => {
    let live = true;
    loadBundledFont().then(
      (f) => live && setFont(f),
      (e) => live && setProblem(`The bundled symbol font could not be read: ${messageOf(e)}`),
    );
    return () => {
      live = false;
    };
  }, []);

  const choices = useMemo(() => {
    if (!font) return [];
    const wanted = font.bundled ? SUGGESTED : [...SUGGESTED, ...LETTERS];
    return wanted.flatMap((cp) => {
      if (!fontHasCharacter(font.font, cp)) return [];
      try {
        const { svg } = characterOutlineSvg(font.font, cp, font.label);
        return [{ cp, url: `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg.replace('<path ', '<path fill="#27332e" '))}` }];
      } catch {
        return [];
      }
    });
  }, [font]);

  const pick = (cp: number) => {
    if (!font) return;
    try {
      onPick(glyphFromFont(font.font, cp, font.label));
      setProblem(null);
    } catch (e) {
      setProblem(messageOf(e));
    }
  };

  const openFont = async () => {
    const result = await host.openSupplied({ purpose: 'font' });
    if (!result.ok) return onNotice(result.error.message, 'error');
    if (!result.value) return;
    try {
      const parsed = readFont(base64ToBytes(result.value.base64));
      setFont({ font: parsed, label: fontFamilyName(parsed, result.value.name), bundled: false });
      setProblem(null);
    } catch (e) {
      setProblem(`${result.value.name}: ${messageOf(e)}`);
    }
  };

  const addTyped = () => {
    try {
      pick(parseCharacter(typed));
    } catch (e) {
      setProblem(messageOf(e));
    }
  };

  return (
    <div className="font-glyph-picker" role="group" aria-label="Glyph from a font character" data-testid="font-glyph-picker">
      <div className="font-glyph-source">
        <span className="field-label">Font</span>
        <span className="font-glyph-font" data-testid="font-glyph-font">
          {font ? font.label : 'Loading the symbol font…'}
        </span>
        {font && !font.bundled && (
          <button type="button" className="link-button" onClick={() => void loadBundledFont().then(setFont)}>
            Bundled symbols
          </button>
        )}
        <button type="button" className="link-button" onClick={() => void openFont()} data-testid="open-font-file">
          Open a font file…
        </button>
      </div>
      <div className="font-glyph-grid" role="listbox" aria-label="Characters">
        {choices.map(({ cp, url }) => (
          <button key={cp} type="button" role="option" aria-selected={false} className="font-glyph-cell" title={`${codePointLabel(cp)} ${String.fromCodePoint(cp)}`} aria-label={`${codePointLabel(cp)} ${String.fromCodePoint(cp)}`} onClick={() => pick(cp)}>
            <img src={url} alt="" width={26} height={26} />
          </button>
        ))}
      </div>
      <div className="font-glyph-typed">
        <input className="cell-input" value={typed} placeholder="✓ or U+2713" aria-label="Character or its code" onChange={(e) => setTyped(e.target.value)} onKeyDown={(e) => e.key === 'Enter' && addTyped()} />
        <button type="button" className="button" onClick={addTyped} disabled={!font || typed.trim() === ''} data-testid="add-font-glyph">
          Use this character
        </button>
        <button type="button" className="link-button" onClick={onClose}>
          Close
        </button>
      </div>
      {problem && <p className="field-problem">{problem}</p>}
      {font?.bundled && <p className="field-hint">Noto Sans Symbols 2, SIL Open Font License 1.1.</p>}
    </div>
  );
}
