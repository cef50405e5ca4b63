// Glyph choice with search over the bundled catalog; each choice shows the glyph itself.
import { useEffect, useLayoutEffect, useMemo, useRef, useState, type ReactElement, type RefObject } from 'react';
import { createPortal } from 'react-dom';
import { getGlyph, type GlyphEntry } from '../../../shared-core/glyph';
import type { GlyphRef } from '../../../shared-core/document';
import { ownGlyphImageUrl } from '../glyphs/ownGlyphImages';
import { BROWSE_CATEGORIES, browseGlyphs, sharePercent, type BrowseCategory } from '../glyphs/browseGlyphs';

const PREVIEW_INK = '#27332e';
const urlCache = new Map<string, string>();

/** A data URL of the bundled glyph for an <img>; glyph markup is ours, bundled, and drawn as an image (no script runs). */
export function glyphImageUrl(name: string): string | null {
  if (name.startsWith('own:')) return ownGlyphImageUrl(name);
  const cached = urlCache.get(name);
  if (cached) return cached;
  let entry: GlyphEntry;
  try {
    entry = getGlyph(name);
  } catch {
    return null;
  }
  const markup = entry.svg.replace(/currentColor/g, PREVIEW_INK);
  const url = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(markup)}`;
  urlCache.set(name, url);
  return url;
}

export function GlyphThumb({ glyph, size = 20 }: { glyph: GlyphRef | undefined; size?: number }): ReactElement {
  if (glyph === undefined) return <span className="glyph-thumb glyph-thumb-empty" style={{ width: size, height: size }} aria-hidden="true" />;
  if (typeof glyph !== 'string') return <span className="glyph-thumb glyph-thumb-custom" style={{ width: size, height: size }} title="Custom SVG glyph">svg</span>;
  const url = glyphImageUrl(glyph);
  if (!url) return <span className="glyph-thumb glyph-thumb-missing" style={{ width: size, height: size }} title={`Unknown glyph "${glyph}"`}>?</span>;
  return <img className="glyph-thumb" src={url} width={size} height={size} alt="" draggable={false} />;
}

interface GlyphPickerProps {
  value: GlyphRef | undefined;
  onChoose: (name: string) => void;
  onClose: () => void;
  /** Offered in a row's picker: go back to the chart's glyph. */
  onClear?: () => void;
  label: string;
  /** The control that opened the picker; the picker sits below it, or above when there is no room. */
  anchor: RefObject<HTMLElement | null>;
}

const PICKER_WIDTH_PX = 352;
const EDGE_PX = 8;

export function GlyphPicker({ value, onChoose: choose, onClose: close, onClear: clear, label, anchor }: GlyphPickerProps): ReactElement {
  // After a choice or Escape, focus goes back to the control that opened the picker, not to the page
  // (WAI-ARIA Authoring Practices, dialog pattern: on close, focus returns to the invoking element).
  // A click elsewhere closes it without moving focus, so the click's own target keeps it.
  const refocus = () => anchor.current?.focus();
  const onChoose = (name: string) => {
    choose(name);
    refocus();
  };
  const onClear = clear
    ? () => {
        clear();
        refocus();
      }
    : undefined;
  const [query, setQuery] = useState('');
  const [category, setCategory] = useState<BrowseCategory>('all');
  const results = useMemo(() => browseGlyphs(query, category), [query, category]);
  const panel = useRef<HTMLDivElement>(null);
  const search = useRef<HTMLInputElement>(null);
  const [place, setPlace] = useState<{ left: number; top: number } | null>(null);

  // Fixed to the viewport and portalled to <body>, so a scrolling side panel cannot clip it. It opens
  // beside its control when there is room (covering the preview, not the controls), else below or above.
  useLayoutEffect(() => {
    const a = anchor.current?.getBoundingClientRect();
    const height = panel.current?.offsetHeight ?? 360;
    if (!a) return;
    const clampTop = (top: number) => Math.min(Math.max(EDGE_PX, top), window.innerHeight - height - EDGE_PX);
    if (a.right + 8 + PICKER_WIDTH_PX <= window.innerWidth - EDGE_PX) {
      setPlace({ left: a.right + 8, top: clampTop(a.top - 8) });
      return;
    }
    const below = a.bottom + 4;
    const top = below + height <= window.innerHeight - EDGE_PX ? below : Math.max(EDGE_PX, a.top - height - 4);
    const left = Math.min(Math.max(EDGE_PX, a.left), window.innerWidth - PICKER_WIDTH_PX - EDGE_PX);
    setPlace({ left, top });
  }, [anchor]);

  useEffect(() => {
    search.current?.focus();
    const onDown = (e: MouseEvent) => {
      const target = e.target as Node;
      if (panel.current?.contains(target) || anchor.current?.contains(target)) return;
      close();
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') {
        e.stopPropagation();
        close();
        anchor.current?.focus();
      }
    };
    document.addEventListener('mousedown', onDown);
    document.addEventListener('keydown', onKey, true);
    return () => {
      document.removeEventListener('mousedown', onDown);
      document.removeEventListener('keydown', onKey, true);
    };
  }, [close, anchor]);

  return createPortal(
    <div
      className="popover glyph-picker"
      ref={panel}
      role="dialog"
      aria-label={label}
      style={{ position: 'fixed', width: PICKER_WIDTH_PX, left: place?.left ?? -9999, top: place?.top ?? 0, visibility: place ? 'visible' : 'hidden' }}
    >
      <div className="glyph-search">
        <svg width="14" height="14" viewBox="0 0 16 16" aria-hidden="true">
          <path d="M7 12a5 5 0 1 1 0-10 5 5 0 0 1 0 10zM10.5 10.5 14 14" fill="none" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" />
        </svg>
        <input
          ref={search}
          type="search"
          placeholder="Search glyphs: bike, tree, money…"
          value={query}
          onChange={(e) => setQuery(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === 'Enter' && results[0]) {
              // Otherwise the Enter's keypress lands on the glyph button, which gets focus back, and reopens the picker.
              e.preventDefault();
              onChoose(results[0].name);
            }
          }}
          aria-label="Search glyphs"
        />
      </div>
      <div className="glyph-categories" role="radiogroup" aria-label="Glyph category">
        {BROWSE_CATEGORIES.map((c) => (
          <button key={c} type="button" role="radio" aria-checked={category === c} className={category === c ? 'glyph-category active' : 'glyph-category'} onClick={() => setCategory(c)}>
            {c}
          </button>
        ))}
      </div>
      <div className="glyph-grid" role="listbox" aria-label="Glyphs">
        {results.map((g) => (
          <button
            key={g.name}
            type="button"
            role="option"
            aria-selected={value === g.name}
            className={value === g.name ? 'glyph-cell selected' : 'glyph-cell'}
            title={`${g.name} (${g.category}${g.tags.length ? ': ' + g.tags.slice(0, 4).join(', ') : ''}); its ink fills ${sharePercent(g.boxFraction)} of its box`}
            onClick={() => onChoose(g.name)}
          >
            <GlyphThumb glyph={g.name} size={26} />
            <span>{g.name.startsWith('own:') ? g.name.slice(4) : g.name}</span>
            <span className="glyph-share" data-testid="glyph-share">{sharePercent(g.boxFraction)}</span>
          </button>
        ))}
        {results.length === 0 && <p className="empty-note">{category === 'yours' && !query ? 'No glyphs of your own in this chart yet.' : `No glyph matches “${query}”${category === 'all' ? '' : ` in ${category}`}.`}</p>}
      </div>
      <div className="popover-foot">
        <span className="muted">{results.length} glyph{results.length === 1 ? '' : 's'} · % = ink share of its box</span>
        {onClear && (
          <button type="button" className="link-button" onClick={onClear}>
            Use the chart’s glyph
          </button>
        )}
      </div>
    </div>,
    document.body,
  );
}
