// The chart document (format "tallyglyph.chart/1"): validation with messages that name the field,
// defaults filled in, and the page converted to millimetres.

import { z } from 'zod';
import { TallyError } from '../errors';
import { CHART_EXTRA_FIELDS, chartExtrasOf } from '../standardise/documentFields';
import type { ChartExtras } from '../standardise/types';

export const CHART_FORMAT = 'tallyglyph.chart/1';
export const KNOWN_CHART_FORMATS: readonly string[] = Object.freeze([CHART_FORMAT]);

/** Millimetres per page unit, from CSS absolute units: 1 in = 25.4 mm = 96 px = 72 pt. */
export const PAGE_UNIT_MM = Object.freeze({ mm: 1, in: 25.4, pt: 25.4 / 72, px: 25.4 / 96 });

export const DEFAULT_MARGIN_MM = 10;
export const DEFAULT_GAP_RATIO = 0.2;

// Bounds that keep a hand-edited or hostile document from asking for absurd work.
const MAX_ROWS = 10_000;
const MAX_INLINE_SVG_CHARS = 1_000_000;
const MAX_PAGE_MM = 10_000;

/**
 * Longest text each field may hold, in characters (Unicode code points). Text on a printed chart is
 * read at a glance: a label longer than a line or two, or a title longer than a sentence, cannot be
 * read beside its marks. Every character is also drawn as an outline and re-measured in the written
 * file, so the caps keep hostile documents from costing minutes. Common practice, no source.
 */
export const TEXT_LIMITS = Object.freeze({ title: 200, source: 300, label: 120, unitName: 60, glyphName: 100 });

// Layout and style options (all optional in the document; absent reproduces the chart as drawn before them).
/** Glyphs per group in a row or column before a wider gap: 0 for no grouping. Fives and tens are how tallies are counted at a glance (common practice, no source). */
export const GROUP_EVERY_CHOICES = Object.freeze([0, 5, 10] as const);
export type GroupEvery = (typeof GROUP_EVERY_CHOICES)[number];
export const LABEL_POSITIONS = Object.freeze(['beside', 'above'] as const);
export type LabelPosition = (typeof LABEL_POSITIONS)[number];
export const LABEL_ALIGNS = Object.freeze(['start', 'end'] as const);
export type LabelAlign = (typeof LABEL_ALIGNS)[number];
/** Order of rows on the chart; the table keeps the order the data were given in. */
export const SORT_ORDERS = Object.freeze(['given', 'descending', 'ascending'] as const);
export type SortOrder = (typeof SORT_ORDERS)[number];
/** Bundled open-licence text fonts: Noto Sans, and a serif face (see assets/fonts/README.md). */
export const TEXT_FONTS = Object.freeze(['sans', 'serif'] as const);
export type TextFont = (typeof TEXT_FONTS)[number];
/** Title size in points: from the print minimum of 6 pt to a poster headline (common practice, no source). */
export const TITLE_SIZE_PT_RANGE = Object.freeze({ min: 6, max: 72 });
/** Source line size in points (common practice, no source; under 6 pt the layout warns it may not print legibly). */
export const SOURCE_SIZE_PT_RANGE = Object.freeze({ min: 5, max: 24 });
/** Longest unit suffix of value labels ("L", "kWh", "people"), in characters. */
export const VALUE_UNIT_MAX = 12;
/** Longest key caption wording, in characters. */
export const KEY_WORDING_MAX = 80;
/** The placeholders a key wording may hold; {amount} is required so the key always states what one glyph stands for. */
export const KEY_WORDING_AMOUNT = '{amount}';
export const KEY_WORDING_UNIT = '{unit}';

export type EncodingMode = 'repeat' | 'stack' | 'scale' | 'fill';
export type Rounding = 'ink-cut' | 'whole';
/** Repeat only: one row of glyphs per category, or one shared icon array showing parts of a whole. */
export type Arrangement = 'per-category' | 'shared-grid';
/** Fill only: fill relative to the largest value, or read values as shares from 0 to 1. */
export type FillTo = 'max' | 'share';
export type Direction = 'ltr' | 'rtl' | 'btt';
export type PageUnit = keyof typeof PAGE_UNIT_MM;
/** A bundled glyph by name, or inline SVG markup (untrusted: import it through the safe reader). */
export type GlyphRef = string | { svg: string };

export interface DataRow {
  label: string;
  value: number;
  glyph?: GlyphRef;
  /** CSS hex colour: #rgb, #rgba, #rrggbb or #rrggbbaa. */
  color?: string;
}

interface EncodingBase {
  /** Amount one glyph stands for (repeat, stack). Absent: the layout chooses one (see chooseUnit). */
  unit?: number;
  /** What is counted, for legends: "bikes". */
  unitName?: string;
  glyph: GlyphRef;
  rounding: Rounding;
}
export interface RepeatEncoding extends EncodingBase {
  mode: 'repeat';
  arrangement: Arrangement;
}
export interface StackEncoding extends EncodingBase {
  mode: 'stack';
}
export interface ScaleEncoding extends EncodingBase {
  mode: 'scale';
}
export interface FillEncoding extends EncodingBase {
  mode: 'fill';
  fillTo: FillTo;
}
export type Encoding = RepeatEncoding | StackEncoding | ScaleEncoding | FillEncoding;

export interface MarginsMm {
  top: number;
  right: number;
  bottom: number;
  left: number;
}

export interface LayoutOptions {
  columns: number | 'auto';
  /** Gap between glyphs as a fraction of the glyph size. */
  gapRatio: number;
  glyphSizeMm?: number;
  direction: Direction;
  colors?: string[];
  labels: boolean;
  valueLabels: boolean;
  legend: boolean;
  margins: MarginsMm;
  bleedMm: number;
  /** Page background: an opaque CSS hex colour painted to the bleed edge, or "none" (absent) for a transparent page. */
  background?: string;
  /** A wider gap after every 5 or 10 glyphs of a row (repeat) or column (stack); absent or 0: even spacing. */
  groupEvery?: GroupEvery;
  /** Category labels beside their row (absent: beside) or above it. */
  labelPosition?: LabelPosition;
  /** Alignment of labels in their column; absent: "end" beside (flush against the marks), "start" above. */
  labelAlign?: LabelAlign;
  /** Suffix of value labels: value 12 with "L" is written "12 L". */
  valueUnit?: string;
  /** Row order on the chart; absent: as given. */
  sort?: SortOrder;
  /** Title size in points; absent: the default size. */
  titleSizePt?: number;
  /** Source line size in points; absent: the default size. */
  sourceSizePt?: number;
  /** Text font; absent: sans (Noto Sans). */
  font?: TextFont;
  /** Key caption with {amount} (and optionally {unit}) filled in from the data; absent: the default wording. */
  keyWording?: string;
}

export interface PageMm {
  widthMm: number;
  heightMm: number;
  /** The size as written in the document, kept so that saving does not change the designer's unit. */
  given: { width: number; height: number; unit: PageUnit };
}

/** A glyph the designer brought in (an SVG file or a font character), kept whole in the document. */
export interface OwnGlyph {
  svg: string;
  /** Where it came from, for the designer: a file name, or a font and character. */
  from?: string;
}

/** A validated chart with every default filled in. Standardisation and dismissed findings: see ChartExtras. */
export interface ChartSpec extends ChartExtras {
  format: typeof CHART_FORMAT;
  /** Glyphs of one's own by name ("own:…"); rows and the encoding refer to them like bundled names. */
  glyphs?: Record<string, OwnGlyph>;
  title?: string;
  source?: string;
  data: DataRow[];
  encoding: Encoding;
  layout: LayoutOptions;
  page: PageMm;
  /** Write text as outlines from the bundled font, so the file needs no installed fonts. */
  outlineText: boolean;
  /** Reuse glyph geometry with <use> (the default); false writes every glyph out in full. */
  useReferences: boolean;
  /** Set only when the document asks to write a chart whose values are all zero (nothing to compare). */
  allowAllZero?: true;
}

// ---------------------------------------------------------------------------------------------
// Messages

function describeInput(input: unknown): string {
  if (input === null) return 'null';
  if (Array.isArray(input)) return 'a list';
  switch (typeof input) {
    case 'string':
      return input.length > 30 ? `the text "${input.slice(0, 30)}..."` : `the text "${input}"`;
    case 'number':
      return String(input);
    case 'boolean':
      return String(input);
    case 'object':
      return 'an object';
    default:
      return `a ${typeof input}`;
  }
}

function expecting(what: string) {
  return (issue: { input?: unknown }): string =>
    issue.input === undefined ? `required: ${what}` : `expected ${what}, got ${describeInput(issue.input)}`;
}

function numberMessage(issue: { input?: unknown }): string {
  if (typeof issue.input === 'number') return `expected a finite number, got ${String(issue.input)}`;
  return expecting('a number')(issue);
}

function oneOf(values: readonly string[]): string {
  return `one of ${values.map((v) => `"${v}"`).join(', ')}`;
}

// ---------------------------------------------------------------------------------------------
// Schema

const finiteNumber = () => z.number({ error: numberMessage });
const positiveNumber = () => finiteNumber().gt(0, { error: (issue) => `must be greater than 0, got ${describeInput(issue.input)}` });
const nonNegativeNumber = () => finiteNumber().min(0, { error: (issue) => `must be 0 or more, got ${describeInput(issue.input)}` });
/** Characters as a reader counts them (code points), so an emoji counts once, not as two UTF-16 units. */
function codePoints(s: string): number {
  let n = 0;
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c < 0xd800 || c > 0xdbff || i + 1 >= s.length) n++;
    else {
      const next = s.charCodeAt(i + 1);
      n++;
      if (next >= 0xdc00 && next <= 0xdfff) i++;
    }
  }
  return n;
}
/** The check that holds text to its field's cap, with a message saying the limit and why it exists. */
const withinCap = <T extends z.ZodString>(schema: T, field: keyof typeof TEXT_LIMITS, what: string) =>
  schema.refine((s) => codePoints(s) <= TEXT_LIMITS[field], {
    error: (issue) =>
      `is ${codePoints(String(issue.input)).toLocaleString('en')} characters long; ${what} may have at most ${TEXT_LIMITS[field]} characters, ` +
      (field === 'glyphName'
        ? 'far longer than any glyph name'
        : 'so it can be read on the printed chart (every character is drawn as an outline and re-measured in the written file)'),
  });
const text = (field: keyof typeof TEXT_LIMITS, what: string) => withinCap(z.string({ error: expecting('text') }), field, what);
const nonEmptyText = (field: keyof typeof TEXT_LIMITS, what: string) => withinCap(z.string({ error: expecting('text') }).min(1, { error: 'must not be empty' }), field, what);
const flag = () => z.boolean({ error: expecting('true or false') });
const choice = <T extends readonly [string, ...string[]]>(values: T) => z.enum(values, { error: expecting(oneOf(values)) });

const HEX_COLOR = /^#(?:[0-9a-fA-F]{3}|[0-9a-fA-F]{4}|[0-9a-fA-F]{6}|[0-9a-fA-F]{8})$/;
const hexColor = () =>
  z.string({ error: expecting('a CSS hex colour such as "#1f77b4"') }).regex(HEX_COLOR, {
    error: (issue) => `expected a CSS hex colour such as "#1f77b4" (#rgb, #rgba, #rrggbb or #rrggbbaa), got ${describeInput(issue.input)}`,
  });

// Reached when neither a name nor an inline object fits; zod reports the inner field itself when
// the input is an object with the right shape.
function glyphMessage(issue: { input?: unknown }): string {
  const input = issue.input;
  if (typeof input === 'object' && input !== null && !Array.isArray(input)) {
    return 'expected { "svg": "<svg ...>" } with the SVG markup as text';
  }
  return expecting('a glyph name such as "bike", or { "svg": "<svg ...>" }')(issue);
}

const glyphSchema = () =>
  z.union(
    [
      withinCap(z.string().min(1, { error: 'must not be empty: give a glyph name such as "bike"' }), 'glyphName', 'a glyph name'),
      z.strictObject({
        svg: z
          .string({ error: expecting('SVG markup as text') })
          .min(1, { error: 'must not be empty: give the SVG markup as text' })
          .max(MAX_INLINE_SVG_CHARS, { error: `is longer than the limit of ${MAX_INLINE_SVG_CHARS} characters` }),
      }),
    ],
    { error: glyphMessage },
  );

const rowSchema = z.strictObject(
  {
    label: nonEmptyText('label', 'a label'),
    value: finiteNumber().min(0, {
      error: (issue) =>
        `is negative (${describeInput(issue.input)}): a count, area or length of ink cannot show a negative amount; ` +
        'chart gains and losses as separate positive amounts',
    }),
    glyph: glyphSchema().optional(),
    color: hexColor().optional(),
  },
  { error: expecting('a row such as { "label": "Station A", "value": 7.5 }') },
);

const MODES = ['repeat', 'stack', 'scale', 'fill'] as const;
const encodingSchema = z.strictObject(
  {
    mode: choice(MODES),
    unit: positiveNumber().optional(),
    unitName: nonEmptyText('unitName', 'the name of what is counted').optional(),
    glyph: glyphSchema(),
    rounding: choice(['ink-cut', 'whole'] as const).default('ink-cut'),
    arrangement: choice(['per-category', 'shared-grid'] as const).optional(),
    fillTo: choice(['max', 'share'] as const).optional(),
  },
  { error: expecting('an object with at least "mode" and "glyph"') },
);

const marginsSchema = z.union(
  [
    nonNegativeNumber(),
    z.strictObject({
      top: nonNegativeNumber().default(DEFAULT_MARGIN_MM),
      right: nonNegativeNumber().default(DEFAULT_MARGIN_MM),
      bottom: nonNegativeNumber().default(DEFAULT_MARGIN_MM),
      left: nonNegativeNumber().default(DEFAULT_MARGIN_MM),
    }),
  ],
  { error: expecting('a margin in mm, or { "top", "right", "bottom", "left" } in mm, each 0 or more') },
);

const ptRange = (range: { min: number; max: number }, what: string) =>
  finiteNumber()
    .min(range.min, { error: (issue) => `${what} must be from ${range.min} to ${range.max} pt, got ${describeInput(issue.input)}` })
    .max(range.max, { error: (issue) => `${what} must be from ${range.min} to ${range.max} pt, got ${describeInput(issue.input)}` });

const keyWordingSchema = () =>
  z
    .string({ error: expecting(`text containing ${KEY_WORDING_AMOUNT}`) })
    .refine((s) => codePoints(s) <= KEY_WORDING_MAX, {
      error: (issue) => `is ${codePoints(String(issue.input))} characters long; the key wording may have at most ${KEY_WORDING_MAX} characters`,
    })
    .refine((s) => s.includes(KEY_WORDING_AMOUNT), {
      error: `must contain ${KEY_WORDING_AMOUNT}, where the amount one glyph stands for is written, so the key always states the unit from the data (for example "Each glyph = {amount} {unit}")`,
    });

const layoutSchema = z.strictObject(
  {
    columns: z
      .union([z.literal('auto'), z.number().int().min(1)], { error: expecting('"auto" or a whole number of at least 1') })
      .default('auto'),
    gapRatio: nonNegativeNumber().max(10, { error: 'must be at most 10 (the gap as a multiple of the glyph size)' }).default(DEFAULT_GAP_RATIO),
    glyphSizeMm: positiveNumber().optional(),
    direction: choice(['ltr', 'rtl', 'btt'] as const).default('ltr'),
    colors: z.array(hexColor(), { error: expecting('a list of CSS hex colours') }).min(1, { error: 'must list at least one colour' }).optional(),
    labels: flag().default(true),
    valueLabels: flag().default(true),
    legend: flag().default(true),
    margins: marginsSchema.default(DEFAULT_MARGIN_MM),
    bleedMm: nonNegativeNumber().default(0),
    background: z.union([z.literal('none'), hexColor()], { error: expecting('"none" or a CSS hex colour such as "#fdf6e3"') }).optional(),
    groupEvery: z
      .union(GROUP_EVERY_CHOICES.map((n) => z.literal(n)) as unknown as [z.ZodLiteral<0>, z.ZodLiteral<5>, z.ZodLiteral<10>], {
        error: expecting('0 (no groups), 5 or 10 glyphs per group'),
      })
      .optional(),
    labelPosition: choice(LABEL_POSITIONS as unknown as ['beside', 'above']).optional(),
    labelAlign: choice(LABEL_ALIGNS as unknown as ['start', 'end']).optional(),
    valueUnit: z
      .string({ error: expecting('a short unit such as "L" or "kWh"') })
      .refine((s) => codePoints(s) <= VALUE_UNIT_MAX && !/[\r\n]/.test(s), {
        error: (issue) => `must be one line of at most ${VALUE_UNIT_MAX} characters, such as "L" or "kWh", got ${describeInput(issue.input)}`,
      })
      .optional(),
    sort: choice(SORT_ORDERS as unknown as ['given', 'descending', 'ascending']).optional(),
    titleSizePt: ptRange(TITLE_SIZE_PT_RANGE, 'the title size').optional(),
    sourceSizePt: ptRange(SOURCE_SIZE_PT_RANGE, 'the source size').optional(),
    font: choice(TEXT_FONTS as unknown as ['sans', 'serif']).optional(),
    keyWording: keyWordingSchema().optional(),
  },
  { error: expecting('an object of layout options') },
);

const pageSchema = z.strictObject(
  {
    width: positiveNumber(),
    height: positiveNumber(),
    unit: choice(['mm', 'in', 'pt', 'px'] as const),
  },
  { error: expecting('{ "width", "height", "unit" }') },
);

// Own glyphs: at most 64, named "own:…" so a name never shadows a bundled glyph.
const MAX_OWN_GLYPHS = 64;
const OWN_GLYPH_NAME = /^own:[a-z0-9][a-z0-9-]{0,59}$/;
const ownGlyphsSchema = z
  .record(
    z.string(),
    z.strictObject({
      svg: z.string({ error: expecting('SVG markup as text') }).min(1).max(MAX_INLINE_SVG_CHARS, { error: `is longer than the limit of ${MAX_INLINE_SVG_CHARS} characters` }),
      from: z.string().max(200).optional(),
    }),
  )
  .refine((g) => Object.keys(g).length <= MAX_OWN_GLYPHS, { error: `holds more than ${MAX_OWN_GLYPHS} glyphs` })
  .superRefine((g, ctx) => {
    for (const key of Object.keys(g)) {
      if (!OWN_GLYPH_NAME.test(key)) ctx.addIssue({ code: 'custom', path: [key], message: `"${key.slice(0, 40)}" must be a name such as "own:studio-cup" (own: then lower-case letters, digits and dashes)` });
    }
  });

/** The document as written (before defaults). Use parseChart for a ChartSpec. */
export const chartDocumentSchema = z.strictObject({
  format: z.literal(CHART_FORMAT),
  title: text('title', 'a title').optional(),
  source: text('source', 'a source line').optional(),
  data: z
    .array(rowSchema, { error: expecting('a list of rows') })
    .min(1, { error: 'is empty: a chart needs at least one row of data' })
    .max(MAX_ROWS, { error: `has more than ${MAX_ROWS} rows` }),
  encoding: encodingSchema,
  layout: layoutSchema.prefault({}),
  page: pageSchema,
  outlineText: flag().default(true),
  // References by default: every copy of a glyph is then an exact translate of one written shape (see svg/translatedPathData.ts).
  useReferences: flag().default(true),
  /** A chart whose values are all zero compares nothing; it is written only when the document asks. */
  allowAllZero: flag().optional(),
  ...CHART_EXTRA_FIELDS,
  glyphs: ownGlyphsSchema.optional(),
});

/** A chart document as a designer or a script writes it. */
export type ChartDocument = z.input<typeof chartDocumentSchema>;
type ParsedDocument = z.output<typeof chartDocumentSchema>;

// ---------------------------------------------------------------------------------------------
// Parsing

type PathKey = PropertyKey;

function pathText(path: readonly PathKey[]): string {
  let out = '';
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`;
    else out += out === '' ? String(key) : `.${String(key)}`;
  }
  return out === '' ? '(document)' : out;
}

export interface DocumentProblem {
  path: string;
  message: string;
}

function problemsOf(error: z.ZodError): DocumentProblem[] {
  const out: DocumentProblem[] = [];
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) out.push({ path: pathText([...issue.path, key]), message: 'unknown field' });
    } else {
      out.push({ path: pathText(issue.path), message: issue.message });
    }
  }
  return out;
}

function invalid(problems: DocumentProblem[]): TallyError {
  const [first] = problems;
  const rest = problems.slice(1).map((p) => p.path);
  const listed = rest.length > 4 ? `${rest.slice(0, 4).join(', ')}, ...` : rest.join(', ');
  const more = rest.length > 0 ? ` (and ${rest.length} more: ${listed})` : '';
  return new TallyError('document-invalid', `${first.path}: ${first.message}${more}`, problems);
}

function checkFormat(doc: unknown): void {
  if (typeof doc !== 'object' || doc === null || Array.isArray(doc)) {
    throw new TallyError('document-invalid', `A chart document must be a JSON object, got ${describeInput(doc)}.`);
  }
  const known = KNOWN_CHART_FORMATS.map((f) => `"${f}"`).join(', ');
  const format = (doc as { format?: unknown }).format;
  if (format === undefined) {
    throw new TallyError('document-version', `The document has no "format" field, so its version is unknown. Known versions: ${known}.`);
  }
  if (typeof format !== 'string' || !KNOWN_CHART_FORMATS.includes(format)) {
    const shown = typeof format === 'string' ? JSON.stringify(format.slice(0, 60)) : describeInput(format);
    throw new TallyError('document-version', `Unknown document format ${shown}. Known versions: ${known}.`);
  }
}

function crossChecks(doc: ParsedDocument): DocumentProblem[] {
  const problems: DocumentProblem[] = [];
  const { encoding, data } = doc;
  if (encoding.arrangement !== undefined && encoding.mode !== 'repeat') {
    problems.push({ path: 'encoding.arrangement', message: `only applies to mode "repeat", not "${encoding.mode}"` });
  }
  if (encoding.fillTo !== undefined && encoding.mode !== 'fill') {
    problems.push({ path: 'encoding.fillTo', message: `only applies to mode "fill", not "${encoding.mode}"` });
  }
  if (encoding.mode === 'fill' && encoding.fillTo === 'share') {
    data.forEach((row, i) => {
      if (row.value > 1) {
        problems.push({ path: `data[${i}].value`, message: `is ${row.value}, more than 1, but encoding.fillTo "share" reads each value as a share from 0 to 1` });
      }
    });
  }
  const firstIndex = new Map<string, number>();
  data.forEach((row, i) => {
    const seen = firstIndex.get(row.label);
    if (seen === undefined) firstIndex.set(row.label, i);
    else problems.push({ path: `data[${i}].label`, message: `"${row.label}" is already used by data[${seen}]; each category needs its own label` });
  });

  const perMm = PAGE_UNIT_MM[doc.page.unit];
  const widthMm = doc.page.width * perMm;
  const heightMm = doc.page.height * perMm;
  if (widthMm > MAX_PAGE_MM || heightMm > MAX_PAGE_MM) {
    problems.push({ path: 'page', message: `is ${round(widthMm)} x ${round(heightMm)} mm; the largest page supported is ${MAX_PAGE_MM} mm on a side` });
  }
  const m = marginsMm(doc.layout.margins);
  if (m.left + m.right >= widthMm) {
    problems.push({ path: 'layout.margins', message: `left and right margins (${round(m.left + m.right)} mm together) leave no room on a page ${round(widthMm)} mm wide` });
  }
  if (m.top + m.bottom >= heightMm) {
    problems.push({ path: 'layout.margins', message: `top and bottom margins (${round(m.top + m.bottom)} mm together) leave no room on a page ${round(heightMm)} mm high` });
  }
  return problems;
}

function round(value: number): number {
  return Number(value.toFixed(3));
}

function marginsMm(margins: ParsedDocument['layout']['margins']): MarginsMm {
  if (typeof margins === 'number') return { top: margins, right: margins, bottom: margins, left: margins };
  return { top: margins.top, right: margins.right, bottom: margins.bottom, left: margins.left };
}

function encodingOf(e: ParsedDocument['encoding']): Encoding {
  const base: EncodingBase = { glyph: e.glyph, rounding: e.rounding };
  if (e.unit !== undefined) base.unit = e.unit;
  if (e.unitName !== undefined) base.unitName = e.unitName;
  switch (e.mode) {
    case 'repeat':
      return { mode: 'repeat', ...base, arrangement: e.arrangement ?? 'per-category' };
    case 'fill':
      return { mode: 'fill', ...base, fillTo: e.fillTo ?? 'max' };
    default:
      return { mode: e.mode, ...base };
  }
}

/**
 * Validates a chart document (an object, or its JSON text) and returns it with every default
 * filled in and the page in millimetres.
 * Throws TallyError 'document-version' for a missing or unknown format, and 'document-invalid'
 * with a message that starts with the field path, e.g. `data[1].value: expected a number, ...`;
 * every problem found is in the error's details as { path, message }.
 */
export function parseChart(json: unknown): ChartSpec {
  let doc = json;
  if (typeof json === 'string') {
    try {
      doc = JSON.parse(json);
    } catch (e) {
      throw new TallyError('document-invalid', `The document is not valid JSON: ${(e as Error).message}`);
    }
  }
  checkFormat(doc);
  const parsed = chartDocumentSchema.safeParse(doc);
  if (!parsed.success) throw invalid(problemsOf(parsed.error));
  const d = parsed.data;
  const problems = crossChecks(d);
  if (problems.length > 0) throw invalid(problems);

  const layout: LayoutOptions = {
    columns: d.layout.columns,
    gapRatio: d.layout.gapRatio,
    direction: d.layout.direction,
    labels: d.layout.labels,
    valueLabels: d.layout.valueLabels,
    legend: d.layout.legend,
    margins: marginsMm(d.layout.margins),
    bleedMm: d.layout.bleedMm,
  };
  if (d.layout.glyphSizeMm !== undefined) layout.glyphSizeMm = d.layout.glyphSizeMm;
  if (d.layout.colors !== undefined) layout.colors = [...d.layout.colors];
  if (d.layout.background !== undefined && d.layout.background !== 'none') layout.background = d.layout.background;
  // The style options are kept only when the document sets them, so an older document saves back unchanged.
  if (d.layout.groupEvery !== undefined) layout.groupEvery = d.layout.groupEvery;
  if (d.layout.labelPosition !== undefined) layout.labelPosition = d.layout.labelPosition;
  if (d.layout.labelAlign !== undefined) layout.labelAlign = d.layout.labelAlign;
  if (d.layout.valueUnit !== undefined) layout.valueUnit = d.layout.valueUnit;
  if (d.layout.sort !== undefined) layout.sort = d.layout.sort;
  if (d.layout.titleSizePt !== undefined) layout.titleSizePt = d.layout.titleSizePt;
  if (d.layout.sourceSizePt !== undefined) layout.sourceSizePt = d.layout.sourceSizePt;
  if (d.layout.font !== undefined) layout.font = d.layout.font;
  if (d.layout.keyWording !== undefined) layout.keyWording = d.layout.keyWording;

  const perMm = PAGE_UNIT_MM[d.page.unit];
  const spec: ChartSpec = {
    format: CHART_FORMAT,
    data: d.data.map((row) => {
      const out: DataRow = { label: row.label, value: row.value };
      if (row.glyph !== undefined) out.glyph = row.glyph;
      if (row.color !== undefined) out.color = row.color;
      return out;
    }),
    encoding: encodingOf(d.encoding),
    layout,
    page: { widthMm: d.page.width * perMm, heightMm: d.page.height * perMm, given: { ...d.page } },
    outlineText: d.outlineText,
    useReferences: d.useReferences,
  };
  if (d.title !== undefined) spec.title = d.title;
  if (d.source !== undefined) spec.source = d.source;
  if (d.allowAllZero === true) spec.allowAllZero = true;
  Object.assign(spec, chartExtrasOf(d));
  if (d.glyphs !== undefined) spec.glyphs = Object.fromEntries(Object.entries(d.glyphs).map(([k, g]) => [k, { ...g }]));
  return spec;
}

/** The document to save for a spec: the page in the unit it was given in, every option written out. */
export function chartToDocument(spec: ChartSpec): ChartDocument {
  const { mode, glyph, rounding, unit, unitName } = spec.encoding;
  const encoding: ChartDocument['encoding'] = { mode, glyph, rounding };
  if (unit !== undefined) encoding.unit = unit;
  if (unitName !== undefined) encoding.unitName = unitName;
  if (spec.encoding.mode === 'repeat') encoding.arrangement = spec.encoding.arrangement;
  if (spec.encoding.mode === 'fill') encoding.fillTo = spec.encoding.fillTo;
  const doc: ChartDocument = {
    format: CHART_FORMAT,
    data: spec.data.map((row) => ({ ...row })),
    encoding,
    layout: { ...spec.layout, margins: { ...spec.layout.margins } },
    page: { ...spec.page.given },
    outlineText: spec.outlineText,
    useReferences: spec.useReferences,
  };
  if (spec.title !== undefined) doc.title = spec.title;
  if (spec.source !== undefined) doc.source = spec.source;
  if (spec.allowAllZero === true) doc.allowAllZero = true;
  Object.assign(doc, chartExtrasOf(spec));
  if (spec.glyphs !== undefined) doc.glyphs = Object.fromEntries(Object.entries(spec.glyphs).map(([k, g]) => [k, { ...g }]));
  return doc;
}
