// Reads a table pasted from a spreadsheet or a text file: tab-, semicolon- or comma-separated, with
// RFC 4180 quoting ("a ""quoted"" cell", commas and line breaks inside quotes).

import { readNumber } from './editorDocument';

export interface PastedRow {
  label: string;
  valueText: string;
  /** Third column, when present and not blank. */
  glyph?: string;
}

export interface PastedTable {
  rows: PastedRow[];
  delimiter: '\t' | ';' | ',';
  /** True when the first line was taken as column names and skipped. */
  headerSkipped: boolean;
}

/** Limits keep a stray paste of a whole file from freezing the editor. */
export const PASTE_LIMITS = Object.freeze({ maxChars: 2_000_000, maxRows: 10_000 });

function countOutsideQuotes(line: string, ch: string): number {
  let n = 0;
  let quoted = false;
  for (const c of line) {
    if (c === '"') quoted = !quoted;
    else if (c === ch && !quoted) n++;
  }
  return n;
}

/**
 * Tab when the first line has one (spreadsheets copy tabs), else semicolon when it splits the line at
 * least as often as the comma does (where the comma is the decimal mark, "a;1,5" has one of each),
 * else comma.
 */
export function detectDelimiter(text: string): '\t' | ';' | ',' {
  const firstLine = text.split(/\r?\n/).find((l) => l.trim() !== '') ?? '';
  if (countOutsideQuotes(firstLine, '\t') > 0) return '\t';
  const semicolons = countOutsideQuotes(firstLine, ';');
  return semicolons > 0 && semicolons >= countOutsideQuotes(firstLine, ',') ? ';' : ',';
}

/** Splits delimited text into rows of cells, honouring quotes. Blank lines are dropped. */
export function splitDelimited(text: string, delimiter: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  let i = 0;
  const pushRow = () => {
    row.push(cell);
    if (row.some((c) => c.trim() !== '')) rows.push(row);
    row = [];
    cell = '';
  };
  while (i < text.length) {
    const c = text[i];
    if (quoted) {
      if (c === '"') {
        if (text[i + 1] === '"') {
          cell += '"';
          i += 2;
          continue;
        }
        quoted = false;
      } else cell += c;
      i++;
      continue;
    }
    if (c === '"' && cell.trim() === '') {
      quoted = true;
      cell = '';
    } else if (c === delimiter) {
      row.push(cell);
      cell = '';
    } else if (c === '\n' || c === '\r') {
      pushRow();
      if (c === '\r' && text[i + 1] === '\n') i++;
    } else cell += c;
    i++;
  }
  pushRow();
  return rows;
}

/**
 * Label, value and optional glyph from pasted text. A first line whose value cell is not a number
 * while the second line's is ("Station, Bikes") is taken as column names. A single column of
 * numbers gets labels "Row 1", "Row 2"...
 */
export function parseTable(text: string): PastedTable {
  const limited = text.length > PASTE_LIMITS.maxChars ? text.slice(0, PASTE_LIMITS.maxChars) : text;
  const delimiter = detectDelimiter(limited);
  const cells = splitDelimited(limited, delimiter).slice(0, PASTE_LIMITS.maxRows + 1);
  const oneColumn = cells.every((r) => r.length === 1);
  const valueOf = (r: string[] | undefined) => (r ? (oneColumn ? r[0] : (r[1] ?? '')) : '');
  const isNumber = (s: string) => readNumber(s).ok;
  const headerSkipped = cells.length >= 2 && !isNumber(valueOf(cells[0])) && isNumber(valueOf(cells[1]));
  const body = (headerSkipped ? cells.slice(1) : cells).slice(0, PASTE_LIMITS.maxRows);
  const rows = body.map((r, i): PastedRow => {
    if (oneColumn) return { label: `Row ${i + 1}`, valueText: r[0].trim() };
    const row: PastedRow = { label: r[0].trim(), valueText: (r[1] ?? '').trim() };
    const glyph = (r[2] ?? '').trim();
    if (glyph !== '') row.glyph = glyph;
    return row;
  });
  return { rows, delimiter, headerSkipped };
}

/** True when clipboard text looks like more than one cell, so a paste should fill the table. */
export function looksTabular(text: string): boolean {
  return /[\t\n\r]/.test(text.trim());
}
