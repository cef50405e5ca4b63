import { afterEach, describe, expect, it, vi } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { parseChart, chartToDocument, type ChartDocument } from '../../../shared-core/document';
import { renderChart } from '../../../shared-core/pipeline';
import { renderDocument } from '../../../renderer/src/pipelineAdapter';
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

  it('two edits in quick succession: the first answer, arriving after the second edit, is dropped; only the second is shown', () => {
    vi.stubGlobal('Worker', FakeWorker);
    const client = createRenderClient();
    const worker = FakeWorker.last!;
    const shown: RenderReply[] = [];
    const passing = renderDocument(docOf(0));
    const second = docOf(1);
    client.render(docOf(0), (r) => shown.push(r));
    client.render(second, (r) => shown.push(r));
    // The second edit is not sent while the first runs, so the first can never answer after it.
    expect(worker.jobs).toHaveLength(1);
    worker.onmessage!({ data: { id: worker.jobs[0].id, outcome: passing, elapsedMs: 5 } });
    expect(shown).toEqual([]);
    expect(worker.jobs).toHaveLength(2);
    expect(worker.jobs[1].document).toEqual(second);
    const answer = renderDocument(second);
    worker.onmessage!({ data: { id: worker.jobs[1].id, outcome: answer, elapsedMs: 7 } });
    expect(shown).toEqual([{ id: worker.jobs[1].id, outcome: answer, elapsedMs: 7 }]);
    client.dispose();
  });

  it('a burst of edits runs the first and the newest only; the ones between are never run or shown', () => {
    vi.stubGlobal('Worker', FakeWorker);
    const client = createRenderClient();
    const worker = FakeWorker.last!;
    const shown: number[] = [];
    for (let i = 0; i < 5; i++) client.render({ ...docOf(0), title: `Edit ${i}` }, (r) => shown.push(r.id));
    const failed = { kind: 'failed', code: 'internal', message: 'stub' } as const;
    worker.onmessage!({ data: { id: worker.jobs[0].id, outcome: failed, elapsedMs: 1 } });
    expect(worker.jobs.map((j) => j.document.title)).toEqual(['Edit 0', 'Edit 4']);
    worker.onmessage!({ data: { id: worker.jobs[1].id, outcome: failed, elapsedMs: 1 } });
    expect(shown).toEqual([worker.jobs[1].id]);
    client.dispose();
  });

  it('a refused result is shown as refused: an earlier passing answer never stands in for it', () => {
    vi.stubGlobal('Worker', FakeWorker);
    const client = createRenderClient();
    const worker = FakeWorker.last!;
    // 12 and 27 drawn as 1 and 3 whole bikes at 10 a bike: lie factor (3 - 1) / (27 / 12 - 1) = 1.6 (Tufte 1983, p. 57), refused.
    const refusedDoc: ChartDocument = { ...docOf(0), data: [{ label: 'Quay', value: 12 }, { label: 'Mill', value: 27 }], encoding: { mode: 'repeat', glyph: 'bike', unit: 10, rounding: 'whole' } };
    const refused = renderDocument(refusedDoc);
    expect(refused.kind === 'checked' && refused.honesty.pass).toBe(false);
    expect(refused.kind === 'checked' && refused.honesty.worst?.lieFactor).toBeCloseTo(1.6, 9);
    const passing = renderDocument(docOf(0));
    expect(passing.kind === 'checked' && passing.honesty.pass).toBe(true);

    const shown: RenderReply[] = [];
    client.render(docOf(0), (r) => shown.push(r));
    client.render(refusedDoc, (r) => shown.push(r));
    worker.onmessage!({ data: { id: worker.jobs[0].id, outcome: passing, elapsedMs: 3 } });
    worker.onmessage!({ data: { id: worker.jobs[1].id, outcome: refused, elapsedMs: 4 } });
    expect(shown).toHaveLength(1);
    const out = shown[0].outcome;
    expect(out.kind).toBe('checked');
    if (out.kind !== 'checked') return;
    expect(out.honesty.pass).toBe(false);
    // The file shown with a refusal is that document's own (re-measured) file, never the earlier passing chart's.
    expect(out.svg).toBe(refused.kind === 'checked' ? refused.svg : undefined);
    expect(out.svg).not.toBe(passing.kind === 'checked' ? passing.svg : undefined);
    expect(out.svg).toMatch(/data-label="Mill"/);
    client.dispose();
  });
});
