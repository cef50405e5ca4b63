// What the recovery copy holds: the editor's own state (half-typed cells included, so nothing typed is
// lost) with the file it belongs to. Read back defensively: a damaged copy is ignored, never half-used.
import { toChartDocument, type EditorDocument } from '../editor/editorDocument';

export const RECOVERY_FORMAT = 'tallyglyph.recovery/1';

export interface RecoveredWork {
  /** The document name shown in the title bar when the work was kept. */
  name: string;
  /** The host's id of the file it came from, if it had been saved or opened. */
  documentId: string | null;
  editor: EditorDocument;
}

export function encodeRecovery(work: RecoveredWork): string {
  return JSON.stringify({ format: RECOVERY_FORMAT, name: work.name, documentId: work.documentId, editor: work.editor });
}

const isString = (v: unknown): v is string => typeof v === 'string';

/** The kept work, or null when the text is not a recovery copy this version can use. */
export function decodeRecovery(text: string): RecoveredWork | null {
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch {
    return null;
  }
  if (typeof parsed !== 'object' || parsed === null) return null;
  const p = parsed as Record<string, unknown>;
  if (p.format !== RECOVERY_FORMAT || !isString(p.name) || !(p.documentId === null || (isString(p.documentId) && /^[A-Za-z0-9_-]{1,128}$/.test(p.documentId)))) return null;
  const e = p.editor as Record<string, unknown> | null;
  if (typeof e !== 'object' || e === null || !Array.isArray(e.rows) || !isString(e.title) || !isString(e.source)) return null;
  const rowsOk = e.rows.every((r: unknown) => {
    const row = r as Record<string, unknown> | null;
    return typeof row === 'object' && row !== null && isString(row.id) && isString(row.label) && isString(row.valueText);
  });
  if (!rowsOk || typeof e.encoding !== 'object' || typeof e.layout !== 'object' || typeof e.page !== 'object' || typeof e.nextRowNumber !== 'number') return null;
  const editor = e as unknown as EditorDocument;
  try {
    // The same conversion the editor runs on every change must accept it (cell problems are fine: they are shown).
    toChartDocument(editor);
  } catch {
    return null;
  }
  return { name: p.name.slice(0, 200) || 'Recovered chart', documentId: p.documentId as string | null, editor };
}
