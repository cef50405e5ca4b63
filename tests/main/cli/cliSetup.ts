// What the command-line test files share: a folder per test with a way to write chart documents into it,
// and the chart that rounding to whole glyphs distorts.
import fs from 'node:fs';
import path from 'node:path';
import { folderPerTest } from '../../helpers/tempDirs';

/** A fresh folder per test, and `writeDoc(name, doc)` that writes a document (object as JSON, or text as is) there and returns its name. */
export function docFolder(prefix: string): { readonly dir: string; writeDoc(name: string, doc: unknown): string } {
  const tmp = folderPerTest(prefix);
  return {
    get dir() {
      return tmp.dir;
    },
    writeDoc(name: string, doc: unknown): string {
      fs.writeFileSync(path.join(tmp.dir, name), typeof doc === 'string' ? doc : JSON.stringify(doc));
      return name;
    },
  };
}

/**
 * 12 and 27 at 10 per whole glyph are drawn as 1 and 3 glyphs: lie factor (3 - 1) / (27/12 - 1) = 1.6
 * (Tufte 1983, p. 57). `encoding` and the other fields add to or replace the base document's.
 */
export function roundedToWholeGlyphs(over: { encoding?: Record<string, unknown>; [field: string]: unknown } = {}) {
  const { encoding, ...rest } = over;
  return {
    format: 'tallyglyph.chart/1',
    title: 'Rounded to whole glyphs',
    data: [
      { label: 'A', value: 12 },
      { label: 'B', value: 27 },
    ],
    encoding: { mode: 'repeat', glyph: 'bike', unit: 10, rounding: 'whole', ...encoding },
    page: { width: 150, height: 100, unit: 'mm' },
    ...rest,
  };
}
