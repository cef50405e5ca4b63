// The preview is the written SVG string itself, shown as an image from a blob URL: no second drawing
// path, no script in the file can run, and what is seen is byte for byte what export writes.
import { useEffect, useMemo, useRef, useState, type ReactElement } from 'react';

interface PreviewProps {
  svg: string | null;
  busy: boolean;
  /** Shown over the picture when it is not the current, exportable chart. */
  overlay: { tone: 'stale' | 'refused' | 'error'; title: string; text: string } | null;
  pageLabel: string;
  elapsedMs: number | null;
}

export function Preview({ svg, busy, overlay, pageLabel, elapsedMs }: PreviewProps): ReactElement {
  const url = useMemo(() => (svg ? URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' })) : null), [svg]);
  useEffect(() => () => {
    if (url) URL.revokeObjectURL(url);
  }, [url]);
  const [zoom, setZoom] = useState<'fit' | 'actual'>('fit');
  const canvas = useRef<HTMLDivElement>(null);
  const [room, setRoom] = useState<{ w: number; h: number } | null>(null);
  const aspect = useMemo(() => (svg ? pageAspect(svg) : null), [svg]);

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

  // Fit: the largest size with the page's own proportions that the stage holds.
  const fitted = zoom === 'fit' && room && aspect ? (room.w / room.h > aspect ? { width: room.h * aspect, height: room.h } : { width: room.w, height: room.w / aspect }) : null;

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
        <div className="segmented small" role="radiogroup" aria-label="Zoom">
          <button type="button" role="radio" aria-checked={zoom === 'fit'} className={zoom === 'fit' ? 'segment active' : 'segment'} onClick={() => setZoom('fit')}>
            Fit
          </button>
          <button type="button" role="radio" aria-checked={zoom === 'actual'} className={zoom === 'actual' ? 'segment active' : 'segment'} onClick={() => setZoom('actual')} title="CSS size: 96 px to the inch">
            100%
          </button>
        </div>
      </div>
      <div className={busy ? 'progress-track on' : 'progress-track'} aria-hidden="true">
        <div className="progress-bar" />
      </div>
      {overlay && (
        <div className={`stage-overlay ${overlay.tone}`} role="note" data-testid="preview-overlay">
          <strong>{overlay.title}</strong>
          <span>{overlay.text}</span>
        </div>
      )}
      <div className={`stage-canvas zoom-${zoom}`} ref={canvas}>
        {url ? (
          <div className={overlay ? `page-frame dimmed ${overlay.tone}` : 'page-frame'}>
            <img
              className="page-image"
              src={url}
              alt="The chart as it will be exported"
              data-testid="preview-image"
              draggable={false}
              style={fitted ? { width: Math.floor(fitted.width), height: Math.floor(fitted.height) } : undefined}
            />
          </div>
        ) : (
          !overlay && <p className="stage-empty">{busy ? 'Drawing the chart…' : 'Nothing to show yet.'}</p>
        )}
      </div>
    </section>
  );
}

/** Width over height of the page the root <svg> declares (its width and height share one unit). */
function pageAspect(svg: string): number | null {
  const root = /<svg\b[^>]*>/.exec(svg)?.[0] ?? '';
  const w = /\swidth="([\d.]+)/.exec(root);
  const h = /\sheight="([\d.]+)/.exec(root);
  const ratio = w && h ? Number(w[1]) / Number(h[1]) : NaN;
  return Number.isFinite(ratio) && ratio > 0 ? ratio : null;
}
