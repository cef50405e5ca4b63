// The layout and style options added to tallyglyph.chart/1: optional, validated with sentences that name
// the field, kept only when set, and absent from every document written before them.
import { describe, expect, it } from 'vitest';
import {
  chartToDocument,
  parseChart,
  GROUP_EVERY_CHOICES,
  KEY_WORDING_MAX,
  LABEL_ALIGNS,
  LABEL_POSITIONS,
  SORT_ORDERS,
  SOURCE_SIZE_PT_RANGE,
  TEXT_FONTS,
  TITLE_SIZE_PT_RANGE,
  VALUE_UNIT_MAX,
} from '../../../shared-core/document/index';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { TallyError } from '../../../shared-core/errors';
import { chartDoc } from '../../helpers/chartDoc';

function problemOf(layout: Record<string, unknown>): TallyError {
  try {
    parseChart(chartDoc({ layout }));
  } catch (e) {
    if (e instanceof TallyError) return e;
    throw e;
  }
  throw new Error(`expected ${JSON.stringify(layout)} to be refused`);
}

describe('layout style options in the document', () => {
  it('exports the option lists the app builds its controls from', () => {
    expect(GROUP_EVERY_CHOICES).toEqual([0, 5, 10]);
    expect(LABEL_POSITIONS).toEqual(['beside', 'above']);
    expect(LABEL_ALIGNS).toEqual(['start', 'end']);
    expect(SORT_ORDERS).toEqual(['given', 'descending', 'ascending']);
    expect(TEXT_FONTS).toEqual(['sans', 'serif']);
    expect(TITLE_SIZE_PT_RANGE).toEqual({ min: 6, max: 72 });
    expect(SOURCE_SIZE_PT_RANGE).toEqual({ min: 5, max: 24 });
    expect(VALUE_UNIT_MAX).toBe(12);
    expect(KEY_WORDING_MAX).toBe(80);
  });

  it('keeps every option it is given and writes it back, and nothing when none is given', () => {
    const layout = {
      groupEvery: 5,
      labelPosition: 'above',
      labelAlign: 'start',
      valueUnit: 'L',
      sort: 'descending',
      titleSizePt: 18,
      sourceSizePt: 8,
      font: 'serif',
      keyWording: 'One drop: {amount} {unit}',
    } as const;
    const spec = parseChart(chartDoc({ layout }));
    expect(spec.layout).toMatchObject(layout);
    expect(chartToDocument(spec).layout).toMatchObject(layout);
    expect(parseChart(chartToDocument(spec))).toEqual(spec);

    const plain = chartToDocument(parseChart(chartDoc()));
    for (const key of Object.keys(layout)) expect(plain.layout).not.toHaveProperty(key);
  });

  it('parses every demo (written before these options) to a spec without them, and saves it back the same', () => {
    for (const demo of DEMO_CHARTS) {
      const spec = parseChart(demo.document);
      for (const key of ['groupEvery', 'labelPosition', 'labelAlign', 'valueUnit', 'sort', 'titleSizePt', 'sourceSizePt', 'font', 'keyWording']) {
        expect(spec.layout, demo.name).not.toHaveProperty(key);
      }
      expect(parseChart(chartToDocument(spec)), demo.name).toEqual(spec);
    }
  });

  it.each([
    [{ groupEvery: 3 }, 'layout.groupEvery', /0 \(no groups\), 5 or 10/],
    [{ labelPosition: 'below' }, 'layout.labelPosition', /"beside", "above"/],
    [{ labelAlign: 'middle' }, 'layout.labelAlign', /"start", "end"/],
    [{ sort: 'random' }, 'layout.sort', /"given", "descending", "ascending"/],
    [{ font: 'comic' }, 'layout.font', /"sans", "serif"/],
    [{ titleSizePt: 100 }, 'layout.titleSizePt', /from 6 to 72 pt, got 100/],
    [{ titleSizePt: 5 }, 'layout.titleSizePt', /from 6 to 72 pt, got 5/],
    [{ sourceSizePt: 30 }, 'layout.sourceSizePt', /from 5 to 24 pt, got 30/],
    [{ sourceSizePt: Number.NaN }, 'layout.sourceSizePt', /finite number|number/],
    [{ valueUnit: 'litres per person' }, 'layout.valueUnit', /at most 12 characters/],
    [{ valueUnit: 12 }, 'layout.valueUnit', /short unit/],
    [{ keyWording: 'Each glyph is one unit' }, 'layout.keyWording', /must contain \{amount\}/],
    [{ keyWording: `{amount} ${'x'.repeat(80)}` }, 'layout.keyWording', /at most 80 characters/],
  ])('refuses %j with a sentence naming the field', (layout, path, message) => {
    const error = problemOf(layout);
    expect(error.code).toBe('document-invalid');
    expect(error.message.startsWith(`${path}: `), error.message).toBe(true);
    expect(error.message).toMatch(message);
  });
});
