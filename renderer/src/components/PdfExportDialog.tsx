// What a PDF for print will be, said before it is made: vector, page size with bleed, text as outlines,
// sRGB colour (CMYK is the printer's step), and checked by an independent renderer before it is written.
import type { ReactElement } from 'react';
import '../documents/documents.css';
import { useDialogFocus } from '../integrity/useDialogFocus';

interface PdfExportDialogProps {
  pageLabel: string;
  bleedMm: number;
  /** The host can write PDFs (the desktop app); the browser cannot run the checking renderer. */
  available: boolean;
  /** Why export is blocked now (the honesty check), or null. */
  blocked: string | null;
  working: boolean;
  onExport: () => void;
  onClose: () => void;
}

export function PdfExportDialog({ pageLabel, bleedMm, available, blocked, working, onExport, onClose }: PdfExportDialogProps): ReactElement {
  // The dialog pattern every modal of the app shares: focus in, Tab kept inside, Escape closes, focus back.
  const { ref: dialog, onKeyDown: onKey } = useDialogFocus(onClose, () => null);
  return (
    <div className="dialog-backdrop" onMouseDown={(e) => e.target === e.currentTarget && onClose()}>
      <div className="dialog" role="dialog" aria-modal="true" aria-labelledby="pdf-dialog-title" ref={dialog} onKeyDown={onKey} data-testid="pdf-dialog">
        <h2 id="pdf-dialog-title">Export PDF for print</h2>
        <dl>
          <dt>Page</dt>
          <dd data-testid="pdf-dialog-page">{bleedMm > 0 ? `${pageLabel}; the trim box is set inside the bleed` : `${pageLabel}, no bleed (set one in Page if the printer asks for it)`}</dd>
          <dt>Drawing</dt>
          <dd>Vector paths; all text converted to outlines, so no fonts are needed</dd>
          <dt>Colour</dt>
          <dd>sRGB, the chart’s own colours, with an sRGB output intent</dd>
          <dt>Checked</dt>
          <dd>Before it is written, the PDF is drawn by an independent renderer (poppler) and every mark’s ink and lie factor are measured again from its pixels</dd>
        </dl>
        <p className="dialog-note" data-testid="pdf-dialog-cmyk">
          <strong>CMYK is out of scope.</strong> Ask your printer which colour profile they want, and let them (or your layout program) convert the PDF; check a proof before the run.
        </p>
        {!available && (
          <p className="dialog-note bad" data-testid="pdf-dialog-unavailable">
            PDF export needs the desktop app: a browser cannot run the renderer that checks the PDF. Export the SVG and place it in your layout program instead.
          </p>
        )}
        {available && blocked && <p className="dialog-note bad">{blocked}</p>}
        <div className="dialog-actions">
          <button type="button" className="button" onClick={onClose}>
            Cancel
          </button>
          <button type="button" className="button primary" disabled={!available || blocked !== null || working} onClick={onExport} data-testid="pdf-dialog-export">
            {working ? 'Checking the PDF…' : 'Export PDF…'}
          </button>
        </div>
      </div>
    </div>
  );
}
