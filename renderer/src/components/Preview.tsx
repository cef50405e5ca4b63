// The preview is the written SVG string itself, shown as an image from a blob URL: no second drawing
// path, no script in the file can run, and what is seen is byte for byte what export writes. Zoom in
// steps or to fit, pan by dragging (or space-drag), and a category picked in the honesty table shown
// by a second picture laid over the first.
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type ReactElement, type ReactNode } from 'react';
import { markOverlay, pageSizeMm } from '../preview/markOverlay';
import '../documents/documents.css';

interface PreviewProps {
  svg: string | null;
  busy: boolean;
  /** Shown over the picture when it is not the current, exportable chart. */
  overlay: { tone: 'stale' | 'refused' | 'error'; title: string; text: string } | null;
  pageLabel: string;
  elapsedMs: number | null;
  /** Shown instead of a picture when there is nothing to draw yet (a new, empty chart). */
  emptyState?: ReactNode;
  /** A notice above the page that needs an answer (the offer to restore unsaved work). */
  notice?: ReactNode;
  /** The category whose marks to show, picked in the honesty table; null shows all alike. */
  highlightLabel?: string | null;
  onClearHighlight?: () => void;
}

/** Zoom steps, as a share of the page's true size on screen (CSS: 96 px to the inch). */
export const ZOOM_STEPS = [0.25, 0.33, 0.5, 0.67, 0.75, 1, 1.25, 1.5, 2, 3, 4, 6, 8];
const MIN_ZOOM = ZOOM_STEPS[0];
const MAX_ZOOM = ZOOM_STEPS[ZOOM_STEPS.length - 1];
const CSS_PX_PER_MM = 96 / 25.4;

type Zoom = { kind: 'fit' } | { kind: 'scale'; scale: number };

function nextStep(scale: number, direction: 1 | -1): number {
  if (direction > 0) return ZOOM_STEPS.find((s) => s > scale + 1e-6) ?? MAX_ZOOM;
  return [...ZOOM_STEPS].reverse().find((s) => s < scale - 1e-6) ?? MIN_ZOOM;
}

function useBlobUrl(text: string | null): string | null {
  const url = useMemo(() => (text ? URL.createObjectURL(new Blob([text], { type: 'image/svg+xml' })) : null), [text]);
  useEffect(() => () => {
    if (url) URL.revokeObjectURL(url);
  }, [url]);
  return url;
}

function isTyping(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  return !!el && (el.tagName === 'INPUT' || el.tagName === 'TEXTAREA' || el.tagName === 'SELECT' || el.isContentEditable);
}

export function Preview({ svg, busy, overlay, pageLabel, elapsedMs, emptyState, notice, highlightLabel = null, onClearHighlight }: PreviewProps): ReactElement {
  const url = useBlobUrl(svg);
  const [zoom, setZoom] = useState<Zoom>({ kind: 'fit' });
  const canvas = useRef<HTMLDivElement>(null);
  const [room, setRoom] = useState<{ w: number; h: number } | null>(null);
  const page = useMemo(() => (svg ? pageSizeMm(svg) : null), [svg]);
  const picked = useMemo(() => (svg && highlightLabel ? markOverlay(svg, highlightLabel) : null), [svg, highlightLabel]);
  const pickedUrl = useBlobUrl(picked?.svg ?? null);
  const [spaceHeld, setSpaceHeld] = useState(false);
  const [dragging, setDragging] = useState(false);
  // Where to scroll once the new size is laid out: a point of the page (0–1) to put at the view's centre.
  const pendingCentre = useRef<{ fx: number; fy: number } | null>(null);

  useEffect(() => {
    const el = canvas.current;
    if (!el) return;
    const measure = () => {
      const style = getComputedStyle(el);
      const w = el.clientWidth - parseFloat(style.paddingLeft) - parseFloat(style.paddingRight);
      const h = el.clientHeight - parseFloat(style.paddingTop) - parseFloat(style.paddingBottom);
      setRoom({ w: Math.max(0, w), h: Math.max(0, h) });
    };
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(el);
    return () => observer.disconnect();
  }, []);

  const natural = page ? { width: page.widthMm * CSS_PX_PER_MM, height: page.heightMm * CSS_PX_PER_MM } : null;
  const fitScale = natural && room && room.w > 0 && room.h > 0 ? Math.min(room.w / natural.width, room.h / natural.height) : null;
  const scale = zoom.kind === 'fit' ? fitScale : zoom.scale;
  const shown = natural && scale ? { width: Math.max(1, Math.floor(natural.width * scale)), height: Math.max(1, Math.floor(natural.height * scale)) } : null;

  /** The page point (0–1 of width and height) now at the centre of the view. */
  const viewCentre = useCallback((): { fx: number; fy: number } => {
    const el = canvas.current;
    const img = el?.querySelector<HTMLElement>('.page-frame');
    if (!el || !img) return { fx: 0.5, fy: 0.5 };
    const r = img.getBoundingClientRect();
    const c = el.getBoundingClientRect();
    const fx = r.width > 0 ? (c.left + c.width / 2 - r.left) / r.width : 0.5;
    const fy = r.height > 0 ? (c.top + c.height / 2 - r.top) / r.height : 0.5;
    return { fx: Math.min(1, Math.max(0, fx)), fy: Math.min(1, Math.max(0, fy)) };
  }, []);

  const zoomTo = useCallback(
    (next: Zoom, centre?: { fx: number; fy: number }) => {
      pendingCentre.current = next.kind === 'fit' ? null : (centre ?? viewCentre());
      setZoom(next);
    },
    [viewCentre],
  );
  const step = useCallback((direction: 1 | -1) => zoomTo({ kind: 'scale', scale: nextStep(scale ?? 1, direction) }), [scale, zoomTo]);

  useLayoutEffect(() => {
    const el = canvas.current;
    const target = pendingCentre.current;
    const frame = el?.querySelector<HTMLElement>('.page-frame');
    if (!el || !target || !frame) return;
    pendingCentre.current = null;
    const r = frame.getBoundingClientRect();
    const c = el.getBoundingClientRect();
    el.scrollLeft += r.left + target.fx * r.width - (c.left + c.width / 2);
    el.scrollTop += r.top + target.fy * r.height - (c.top + c.height / 2);
  }, [shown?.width, shown?.height]);

  // Picking a category zooms to its marks (never below fit, at most 400%) and centres them.
  useEffect(() => {
    if (!picked || !natural || !room || !fitScale) return;
    const { box, viewBox } = picked;
    const fitMarks = Math.min(room.w / ((box.width / viewBox.width) * natural.width * 1.25), room.h / ((box.height / viewBox.height) * natural.height * 1.25));
    const target = Math.max(fitScale, Math.min(4, fitMarks));
    zoomTo({ kind: 'scale', scale: target }, { fx: (box.x + box.width / 2 - viewBox.x) / viewBox.width, fy: (box.y + box.height / 2 - viewBox.y) / viewBox.height });
    // Only when the pick changes, not on every resize.
  }, [picked]);

  // Space held: the hand for panning, as in drawing programs; outside text fields only. Over the page
  // (or with the page focused) the key is the hand's alone: it neither scrolls nor presses a focused button.
  const hovering = useRef(false);
  useEffect(() => {
    const ours = () => hovering.current || canvas.current?.contains(document.activeElement) || document.activeElement === document.body;
    const down = (e: KeyboardEvent) => {
      if (e.code !== 'Space' || isTyping(e.target)) return;
      if (!e.repeat) setSpaceHeld(true);
      if (ours()) e.preventDefault();
    };
    const up = (e: KeyboardEvent) => {
      if (e.code !== 'Space') return;
      setSpaceHeld(false);
      if (!isTyping(e.target) && ours()) e.preventDefault();
    };
    const blur = () => setSpaceHeld(false);
    window.addEventListener('keydown', down);
    window.addEventListener('keyup', up);
    window.addEventListener('blur', blur);
    return () => {
      window.removeEventListener('keydown', down);
      window.removeEventListener('keyup', up);
      window.removeEventListener('blur', blur);
    };
  }, []);

  const drag = useRef<{ x: number; y: number; left: number; top: number; id: number } | null>(null);
  const onPointerDown = (e: React.PointerEvent<HTMLDivElement>) => {
    const el = canvas.current;
    if (!el || e.button !== 0) return;
    const scrollable = el.scrollWidth > el.clientWidth || el.scrollHeight > el.clientHeight;
    if (!scrollable && !spaceHeld) return;
    drag.current = { x: e.clientX, y: e.clientY, left: el.scrollLeft, top: el.scrollTop, id: e.pointerId };
    el.setPointerCapture(e.pointerId);
    setDragging(true);
    e.preventDefault();
  };
  const onPointerMove = (e: React.PointerEvent<HTMLDivElement>) => {
    const el = canvas.current;
    const d = drag.current;
    if (!el || !d || d.id !== e.pointerId) return;
    el.scrollLeft = d.left - (e.clientX - d.x);
    el.scrollTop = d.top - (e.clientY - d.y);
  };
  const endDrag = (e: React.PointerEvent<HTMLDivElement>) => {
    if (drag.current?.id !== e.pointerId) return;
    drag.current = null;
    setDragging(false);
  };

  // Ctrl/⌘ + wheel zooms about the pointer, as in other design tools.
  useEffect(() => {
    const el = canvas.current;
    if (!el) return;
    const onWheel = (e: WheelEvent) => {
      if (!e.ctrlKey && !e.metaKey) return;
      e.preventDefault();
      const frame = el.querySelector<HTMLElement>('.page-frame');
      const r = frame?.getBoundingClientRect();
      const centre = r && r.width > 0 ? { fx: Math.min(1, Math.max(0, (e.clientX - r.left) / r.width)), fy: Math.min(1, Math.max(0, (e.clientY - r.top) / r.height)) } : undefined;
      setZoom((z) => {
        const current = z.kind === 'scale' ? z.scale : (fitScaleRef.current ?? 1);
        pendingCentre.current = centre ?? null;
        return { kind: 'scale', scale: nextStep(current, e.deltaY < 0 ? 1 : -1) };
      });
    };
    el.addEventListener('wheel', onWheel, { passive: false });
    return () => el.removeEventListener('wheel', onWheel);
  }, []);
  const fitScaleRef = useRef(fitScale);
  fitScaleRef.current = fitScale;

  const onKeyDown = (e: React.KeyboardEvent<HTMLDivElement>) => {
    if (e.ctrlKey || e.metaKey || e.altKey) return;
    if (e.key === '+' || e.key === '=') step(1);
    else if (e.key === '-') step(-1);
    else if (e.key === '0') zoomTo({ kind: 'fit' });
    else if (e.key === '1') zoomTo({ kind: 'scale', scale: 1 });
    else if (e.key === 'Escape' && highlightLabel) onClearHighlight?.();
    else return;
    e.preventDefault();
  };

  const percent = scale ? `${Math.round(scale * 100)}%` : '—';
  const canvasClass = ['stage-canvas', zoom.kind === 'fit' ? 'zoom-fit' : 'zoom-scaled', spaceHeld ? 'pan-ready' : '', dragging ? 'panning' : ''].filter(Boolean).join(' ');

  return (
    <section className="stage" aria-label="Preview">
      <div className="stage-bar">
        <span className="stage-title">Preview</span>
        <span className="stage-meta">{pageLabel}</span>
        <span className="spacer" />
        <span className={busy ? 'busy-label on' : 'busy-label'} role="status" aria-live="polite" data-testid="busy">
          {busy ? (
            <>
              <span className="spinner" aria-hidden="true" /> Laying out and measuring…
            </>
          ) : elapsedMs !== null ? (
            `Checked in ${Math.round(elapsedMs)} ms`
          ) : (
            ''
          )}
        </span>
        <div className="zoom-tools" role="group" aria-label="Zoom">
          <button type="button" className="zoom-button" onClick={() => step(-1)} disabled={!scale || scale <= MIN_ZOOM + 1e-6} aria-label="Zoom out" title="Zoom out (−)" data-testid="zoom-out">
            −
          </button>
          <span className="zoom-value" data-testid="zoom-value" aria-live="polite">
            {percent}
          </span>
          <button type="button" className="zoom-button" onClick={() => step(1)} disabled={!scale || scale >= MAX_ZOOM - 1e-6} aria-label="Zoom in" title="Zoom in (+)" data-testid="zoom-in">
            +
          </button>
          <button type="button" className={zoom.kind === 'fit' ? 'zoom-button wide active' : 'zoom-button wide'} aria-pressed={zoom.kind === 'fit'} onClick={() => zoomTo({ kind: 'fit' })} title="Fit the page in the view (0)" data-testid="zoom-fit">
            Fit
          </button>
          <button type="button" className={zoom.kind === 'scale' && Math.abs(zoom.scale - 1) < 1e-6 ? 'zoom-button wide active' : 'zoom-button wide'} aria-pressed={zoom.kind === 'scale' && Math.abs(zoom.scale - 1) < 1e-6} onClick={() => zoomTo({ kind: 'scale', scale: 1 })} title="True size: 96 CSS px to the inch (1)" data-testid="zoom-actual">
            100%
          </button>
        </div>
      </div>
      <div className={busy ? 'progress-track on' : 'progress-track'} aria-hidden="true">
        <div className="progress-bar" />
      </div>
      {notice}
      {overlay && (
        <div className={`stage-overlay ${overlay.tone}`} role="note" data-testid="preview-overlay">
          <strong>{overlay.title}</strong>
          <span>{overlay.text}</span>
        </div>
      )}
      {picked && highlightLabel && (
        <div className="stage-overlay pick" role="note" data-testid="highlight-note">
          <strong>Showing “{highlightLabel}”</strong>
          <span>
            Its glyphs are framed and the rest of the page dimmed, here only: the exported file is unchanged.
          </span>
          <button type="button" className="link-button" onClick={() => onClearHighlight?.()} data-testid="highlight-clear">
            Show all
          </button>
        </div>
      )}
      <div
        className={canvasClass}
        ref={canvas}
        tabIndex={0}
        aria-label="Chart page. Plus and minus zoom, 0 fits, 1 shows true size; drag or hold space and drag to pan."
        onKeyDown={onKeyDown}
        onPointerEnter={() => {
          hovering.current = true;
        }}
        onPointerLeave={() => {
          hovering.current = false;
        }}
        onPointerDown={onPointerDown}
        onPointerMove={onPointerMove}
        onPointerUp={endDrag}
        onPointerCancel={endDrag}
        data-testid="preview-canvas"
      >
        {url && !emptyState ? (
          <div className={overlay ? `page-frame dimmed ${overlay.tone}` : 'page-frame'} style={shown ? { width: shown.width, height: shown.height } : undefined}>
            <img className="page-image" src={url} alt="The chart as it will be exported" data-testid="preview-image" draggable={false} style={shown ? { width: shown.width, height: shown.height } : undefined} />
            {pickedUrl && <img className="page-pick" src={pickedUrl} alt="" aria-hidden="true" data-testid="preview-highlight" draggable={false} />}
          </div>
        ) : emptyState ? (
          <div className="stage-empty-state" data-testid="empty-state">
            {emptyState}
          </div>
        ) : (
          !overlay && <p className="stage-empty">{busy ? 'Drawing the chart…' : 'Nothing to show yet.'}</p>
        )}
      </div>
    </section>
  );
}
