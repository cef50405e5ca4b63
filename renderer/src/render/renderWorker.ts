// Runs layout, writing and verification off the main thread, so typing stays smooth while a large
// chart is measured. One job at a time; the page sends the next only when this one has answered.
import { renderDocument } from '../pipelineAdapter';
import type { RenderJob, RenderReply } from './renderClient';

const scope = self as unknown as { onmessage: ((e: MessageEvent<RenderJob>) => void) | null; postMessage(reply: RenderReply): void };

scope.onmessage = (e) => {
  const { id, document } = e.data;
  const started = performance.now();
  const outcome = renderDocument(document);
  scope.postMessage({ id, outcome, elapsedMs: performance.now() - started });
};
