import { afterEach, describe, expect, it, vi } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { parseChart, chartToDocument, type ChartDocument } from '../../../shared-core/document';
import { renderChart } from '../../../shared-core/pipeline';
import { createRenderClient, type RenderJob, type RenderReply } from '../../../renderer/src/render/renderClient';

/** A stand-in for the module worker: records jobs, answers or fails when the test says so. */
class FakeWorker {
  static last: FakeWorker | null = null;
  jobs: RenderJob[] = [];
  terminated = false;
  onmessage: ((e: { data: RenderReply }) => void) | null = null;
  onerror: ((e: { preventDefault(): void }) => void) | null = null;
  onmessageerror: (() => void) | null = null;
  constructor() {
    FakeWorker.last = this;
  }
  postMessage(job: RenderJob) {
    this.jobs.push(job);
  }
  terminate() {
    this.terminated = true;
  }
}

const docOf = (i: number): ChartDocument => chartToDocument(parseChart(DEMO_CHARTS[i].document));

afterEach(() => {
  vi.unstubAllGlobals();
  FakeWorker.last = null;
});

describe('createRenderClient', () => {
  it('after a worker crash that follows an answer, stops the worker and renders the pending document on this thread', async () => {
    vi.stubGlobal('Worker', FakeWorker);
    const client = createRenderClient();
    const worker = FakeWorker.last!;
    expect(client.usesWorker).toBe(true);

    const first = new Promise<RenderReply>((resolve) => client.render(docOf(0), resolve));
    worker.onmessage!({ data: { id: worker.jobs[0].id, outcome: { kind: 'failed', code: 'internal', message: 'stub' }, elapsedMs: 1 } });
    expect((await first).id).toBe(worker.jobs[0].id);

    // The second job is sent, then the worker dies without answering it.
    const second = new Promise<RenderReply>((resolve) => client.render(docOf(1), resolve));
    expect(worker.jobs).toHaveLength(2);
    worker.onerror!({ preventDefault() {} });
    expect(worker.terminated).toBe(true);
    expect(client.usesWorker).toBe(false);

    const reply = await second;
    // Run inline by the real pipeline: the same file the Node pipeline writes for that document.
    expect(reply.outcome.kind).toBe('checked');
    expect(reply.outcome.kind === 'checked' && reply.outcome.svg).toBe(renderChart(docOf(1)).svg);

    // And later documents do not wait on the dead worker.
    const third = await new Promise<RenderReply>((resolve) => client.render(docOf(0), resolve));
    expect(third.outcome.kind === 'checked' && third.outcome.svg).toBe(renderChart(docOf(0)).svg);
    expect(worker.jobs).toHaveLength(2);
    client.dispose();
  });
});
