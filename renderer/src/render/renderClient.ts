// Sends chart documents to the render worker, latest first: while a run is busy only the newest
// waiting document is kept, so a burst of edits costs one extra run, not one per keystroke.
// Falls back to running on the main thread where module workers are unavailable.
import type { ChartDocument } from '../../../shared-core/document';
import type { RenderOutcome } from './renderTypes';

export interface RenderJob {
  id: number;
  document: ChartDocument;
}

export interface RenderReply {
  id: number;
  outcome: RenderOutcome;
  elapsedMs: number;
}

export interface RenderClient {
  /** Queues a document; the callback gets its outcome unless a newer document was queued first. */
  render(document: ChartDocument, onDone: (reply: RenderReply) => void): void;
  readonly usesWorker: boolean;
  dispose(): void;
}

type Pending = { job: RenderJob; onDone: (reply: RenderReply) => void };

export function createRenderClient(): RenderClient {
  let worker: Worker | null = null;
  try {
    worker = new Worker(new URL('./renderWorker.ts', import.meta.url), { type: 'module', name: 'tallyglyph-render' });
  } catch {
    worker = null;
  }
  let nextId = 1;
  let running: Pending | null = null;
  let waiting: Pending | null = null;

  function runInline(p: Pending): void {
    // Loaded only when needed; a macrotask, so the busy state paints before the main thread is occupied.
    void import('../pipelineAdapter').then(({ renderDocument }) =>
      setTimeout(() => {
        const started = performance.now();
        const outcome = renderDocument(p.job.document);
        finish({ id: p.job.id, outcome, elapsedMs: performance.now() - started });
      }, 0),
    );
  }

  function start(p: Pending): void {
    running = p;
    if (worker) worker.postMessage(p.job);
    else runInline(p);
  }

  function finish(reply: RenderReply): void {
    const done = running;
    running = null;
    if (waiting) {
      const next = waiting;
      waiting = null;
      start(next);
    } else if (done && done.job.id === reply.id) done.onDone(reply);
  }

  /**
   * A worker that fails (blocked, a loading error, or a crash after it has answered before): stop
   * it and run here from now on, retrying the newest document so the UI never waits on a dead run.
   */
  function abandonWorker(): void {
    worker?.terminate();
    worker = null;
    const retry = waiting ?? running;
    running = null;
    waiting = null;
    if (retry) start(retry);
  }

  if (worker) {
    worker.onmessage = (e: MessageEvent<RenderReply>) => finish(e.data);
    worker.onerror = (e) => {
      e.preventDefault();
      abandonWorker();
    };
    worker.onmessageerror = () => abandonWorker();
  }

  return {
    render(document, onDone) {
      const p: Pending = { job: { id: nextId++, document }, onDone };
      if (running) waiting = p;
      else start(p);
    },
    get usesWorker() {
      return worker !== null;
    },
    dispose() {
      worker?.terminate();
      worker = null;
      running = null;
      waiting = null;
    },
  };
}
