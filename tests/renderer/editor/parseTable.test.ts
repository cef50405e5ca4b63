import { describe, expect, it } from 'vitest';
import { detectDelimiter, looksTabular, parseTable, splitDelimited } from '../../../renderer/src/editor/parseTable';

describe('splitDelimited', () => {
  // RFC 4180 §2: fields with commas, quotes or line breaks are quoted; a quote inside is doubled.
  it('follows RFC 4180 quoting', () => {
    const text = 'name,value\r\n"Smith, J.",4\r\n"say ""hi""",5\n"two\nlines",6\n';
    expect(splitDelimited(text, ',')).toEqual([
      ['name', 'value'],
      ['Smith, J.', '4'],
      ['say "hi"', '5'],
      ['two\nlines', '6'],
    ]);
  });

  it('drops blank lines', () => {
    expect(splitDelimited('a\t1\n\n\nb\t2', '\t')).toEqual([
      ['a', '1'],
      ['b', '2'],
    ]);
  });
});

describe('parseTable', () => {
  it('reads spreadsheet tabs, skips a header line and keeps an optional glyph column', () => {
    const out = parseTable('Station\tRides\tGlyph\nNorth\t12\tbus\nSouth\t7.5\t\n');
    expect(out.delimiter).toBe('\t');
    expect(out.headerSkipped).toBe(true);
    expect(out.rows).toEqual([
      { label: 'North', valueText: '12', glyph: 'bus' },
      { label: 'South', valueText: '7.5' },
    ]);
  });

  it('prefers semicolons where they split the line at least as often (CSV from locales with decimal commas)', () => {
    expect(detectDelimiter('a;1,5\nb;2')).toBe(';');
    expect(parseTable('a;3\nb;4').rows).toEqual([
      { label: 'a', valueText: '3' },
      { label: 'b', valueText: '4' },
    ]);
  });

  it('keeps values that are not numbers as text, so the table can show the problem', () => {
    const out = parseTable('a,12\nb,lots');
    expect(out.headerSkipped).toBe(false);
    expect(out.rows[1]).toEqual({ label: 'b', valueText: 'lots' });
  });

  it('labels a single column of numbers by row', () => {
    expect(parseTable('3\n4\n').rows).toEqual([
      { label: 'Row 1', valueText: '3' },
      { label: 'Row 2', valueText: '4' },
    ]);
  });

  it('tells a table from a single cell', () => {
    expect(looksTabular('12')).toBe(false);
    expect(looksTabular('a\t1')).toBe(true);
    expect(looksTabular('a,1\nb,2')).toBe(true);
  });
});
