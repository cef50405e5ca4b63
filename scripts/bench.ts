// Speed figures for the core operations. Prints numbers; asserts nothing (speed goals live here, not in tests).
import { performance } from 'node:perf_hooks';
import { cutInk, listGlyphs, measureGlyph } from '../shared-core/glyph';

function time<T>(label: string, runs: number, fn: () => T): T {
  let out!: T;
  fn(); // warm-up
  const t0 = performance.now();
  for (let i = 0; i < runs; i++) out = fn();
  const ms = (performance.now() - t0) / runs;
  console.log(`${label.padEnd(48)} ${ms.toFixed(2).padStart(9)} ms/run  (${runs} runs)`);
  return out;
}

const glyphs = listGlyphs();
time(`measure all ${glyphs.length} bundled glyphs`, 3, () => glyphs.map((g) => measureGlyph(g.svg).areaUnits2));
const person = measureGlyph(glyphs.find((g) => g.name === 'person')!.svg);
time('ink-true cut of person at 0.37 (ltr)', 50, () => cutInk(person.region, 0.37, 'ltr'));
time('ink-true cut of person at 0.37 (btt)', 50, () => cutInk(person.region, 0.37, 'btt'));

const optional: [string, () => Promise<void>][] = [
  ['pipeline', async () => {
    const { renderChart } = await import('../shared-core/pipeline');
    const { DEMO_CHARTS } = (await import('../shared-core/demo/demoCharts')) as unknown as { DEMO_CHARTS: { name?: string; document?: unknown }[] | Record<string, unknown> };
    const docs = Array.isArray(DEMO_CHARTS) ? DEMO_CHARTS.map((d) => ('document' in d ? d.document : d)) : Object.values(DEMO_CHARTS);
    docs.forEach((doc, i) => time(`render + verify demo chart ${i + 1}`, 3, () => renderChart(doc as never)));
  }],
];
for (const [name, run] of optional) {
  try {
    await run();
  } catch (e) {
    console.log(`${name}: not measured (${e instanceof Error ? e.message.split('\n')[0] : String(e)})`);
  }
}
