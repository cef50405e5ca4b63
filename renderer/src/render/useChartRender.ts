// Keeps the layout-and-check outcome in step with the document: debounced, off the main thread,
// with the busy state shown, and recent outcomes kept so undo shows its chart at once.
import { useEffect, useRef, useState } from 'react';
import type { ChartDocument } from '../../../shared-core/document';
import { createRenderClient, type RenderClient } from './renderClient';
import type { RenderOutcome } from './renderTypes';

/** Long enough to let a burst of typing settle, short enough to feel live (common practice, no source). */
export const RENDER_DEBOUNCE_MS = 160;
const CACHE_SIZE = 24;

export interface ChartRenderState {
  outcome: RenderOutcome | null;
  /** Key of the document the outcome belongs to; compare with keyOfDocument(current) for freshness. */
  outcomeKey: string | null;
  busy: boolean;
  elapsedMs: number | null;
}

export function keyOfDocument(doc: ChartDocument | null): string | null {
  return doc ? JSON.stringify(doc) : null;
}

export function useChartRender(chartDocument: ChartDocument | null): ChartRenderState {
  const client = useRef<RenderClient | null>(null);
  const cache = useRef(new Map<string, { outcome: RenderOutcome; elapsedMs: number }>());
  // The document the UI wants now; a late answer for an older one is cached but not shown.
  const wanted = useRef<string | null>(null);
  const [state, setState] = useState<ChartRenderState>({ outcome: null, outcomeKey: null, busy: chartDocument !== null, elapsedMs: null });
  const hasOutcome = state.outcome !== null;

  useEffect(() => {
    const c = createRenderClient();
    client.current = c;
    return () => {
      c.dispose();
      if (client.current === c) client.current = null;
    };
  }, []);

  useEffect(() => {
    const key = keyOfDocument(chartDocument);
    wanted.current = key;
    if (!chartDocument || key === null) {
      setState((s) => (s.busy ? { ...s, busy: false } : s));
      return;
    }
    const cached = cache.current.get(key);
    if (cached) {
      setState({ outcome: cached.outcome, outcomeKey: key, busy: false, elapsedMs: cached.elapsedMs });
      return;
    }
    setState((s) => (s.busy ? s : { ...s, busy: true }));
    const timer = setTimeout(
      () => {
        client.current?.render(chartDocument, (reply) => {
          const store = cache.current;
          store.set(key, { outcome: reply.outcome, elapsedMs: reply.elapsedMs });
          while (store.size > CACHE_SIZE) store.delete(store.keys().next().value as string);
          if (wanted.current === key) setState({ outcome: reply.outcome, outcomeKey: key, busy: false, elapsedMs: reply.elapsedMs });
        });
      },
      hasOutcome ? RENDER_DEBOUNCE_MS : 0,
    );
    return () => clearTimeout(timer);
    // hasOutcome only decides the first run's delay; it is left out of the dependencies on purpose.
  }, [chartDocument]);

  return state;
}
