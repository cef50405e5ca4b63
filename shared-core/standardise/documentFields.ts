// The document fields for standardisation and dismissed findings, validated here and spread into the chart
// schema, so the chart document grows by one self-contained block and older documents parse unchanged.
import { z } from 'zod';
import type { ChartExtras } from './types';

// Bounds that keep a hand-edited document from asking for absurd work, in step with the chart's own.
const MAX_ENTRIES = 10_000;
const MAX_COLUMNS = 50;
const MAX_STEPS = 20;
const MAX_DISMISSED = 500;
const MAX_TEXT = 10_000;

const text = () => z.string({ error: 'expected text' }).min(1, { error: 'must not be empty' }).max(MAX_TEXT, { error: `must be at most ${MAX_TEXT} characters` });
const finite = () => z.number({ error: 'expected a finite number' });
const bounded = <T extends z.ZodType>(value: T, what: string) =>
  z.record(z.string(), value, { error: `expected an object of ${what} by label` }).refine((r) => Object.keys(r).length <= MAX_ENTRIES, { error: `has more than ${MAX_ENTRIES} entries` });

const columnSchema = z.strictObject(
  { unitName: text().optional(), values: bounded(z.union([finite(), z.string().max(MAX_TEXT)], { error: 'expected a number or text' }), 'cells') },
  { error: 'expected { "values": { "<row label>": number or text }, "unitName"?: text }' },
);

const stepSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('price-index'), basePeriod: text(), periodColumn: text().optional(), indexColumn: text().optional() }),
    z.strictObject({ kind: z.literal('per-capita'), column: text(), per: finite().gt(0, { error: 'must be greater than 0, e.g. 1000 or 100000' }), baseName: text().optional() }),
    z.strictObject({ kind: z.literal('share-of-total') }),
    z.strictObject({ kind: z.literal('index-to-base'), basePeriod: text(), periodColumn: text().optional() }),
  ],
  { error: 'expected a step with "kind" one of "price-index", "per-capita", "share-of-total", "index-to-base"' },
);

const standardiseSchema = z.strictObject(
  {
    columns: z.record(z.string(), columnSchema, { error: 'expected an object of columns by name' }).refine((c) => Object.keys(c).length <= MAX_COLUMNS, { error: `has more than ${MAX_COLUMNS} columns` }).optional(),
    priceIndex: z.strictObject({ name: text().optional(), values: bounded(finite(), 'index values') }, { error: 'expected { "values": { "<period>": number }, "name"?: text }' }).optional(),
    adjustments: z
      .strictObject(
        {
          original: z.strictObject({ unitName: text().optional(), values: bounded(finite(), 'numbers') }),
          steps: z.array(stepSchema, { error: 'expected a list of steps' }).min(1, { error: 'must list at least one step' }).max(MAX_STEPS, { error: `has more than ${MAX_STEPS} steps` }),
        },
        { error: 'expected { "original": {...}, "steps": [...] }' },
      )
      .optional(),
  },
  { error: 'expected an object with "columns", "priceIndex" or "adjustments"' },
);

const dismissedSchema = z
  .array(
    z.strictObject(
      { code: text(), category: text().optional(), reason: text() },
      { error: 'expected { "code", "reason", "category"? }: a dismissed finding keeps the reason it was set aside' },
    ),
    { error: 'expected a list of dismissed findings' },
  )
  .max(MAX_DISMISSED, { error: `has more than ${MAX_DISMISSED} entries` });

/** Spread into the chart document's schema. */
export const CHART_EXTRA_FIELDS = {
  standardise: standardiseSchema.optional(),
  dismissed: dismissedSchema.optional(),
};

/** The extras of a parsed document, copied (only the fields present), for a ChartSpec or a saved document. */
export function chartExtrasOf(d: ChartExtras): ChartExtras {
  const out: ChartExtras = {};
  if (d.standardise !== undefined) out.standardise = JSON.parse(JSON.stringify(d.standardise)) as NonNullable<ChartExtras['standardise']>;
  if (d.dismissed !== undefined) out.dismissed = d.dismissed.map((x) => ({ ...x }));
  return out;
}
