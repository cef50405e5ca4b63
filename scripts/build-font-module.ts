// Turns the bundled Noto Sans WOFF files into committed TypeScript modules (base64 sfnt bytes),
// so shared-core can parse the font without file I/O. Run with `npx tsx scripts/build-font-module.ts`
// (`--check` exits 1 when a committed module is stale instead of writing it).
//
// Why sfnt rather than the WOFF bytes: opentype.js 2.0.0 cannot read the Extension (type 9) GPOS
// lookups that hold most of Noto Sans' kerning, so shared-core/text reads the GPOS table itself and
// needs the uncompressed tables. The same bytes also load as a plain .ttf in other tools.

import { createHash } from 'node:crypto';
import { copyFileSync, readFileSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { inflateSync } from 'node:zlib';

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const fontPackage = '@fontsource/noto-sans';

export const fontWeights = [400, 700] as const;

export interface FontSource {
  weight: (typeof fontWeights)[number];
  woffPath: string;
  woffFileName: string;
  packageVersion: string;
}

/** Where the npm package keeps the latin-subset WOFF for a weight. */
export function fontSource(weight: (typeof fontWeights)[number]): FontSource {
  const packageDir = fontPackageDir();
  const woffFileName = `noto-sans-latin-${weight}-normal.woff`;
  const packageJson = JSON.parse(readFileSync(join(packageDir, 'package.json'), 'utf8')) as { version: string };
  return { weight, woffPath: join(packageDir, 'files', woffFileName), woffFileName, packageVersion: packageJson.version };
}

export function fontPackageDir(): string {
  // The package's exports map hides package.json, so resolve the LICENSE it does export.
  const require = createRequire(import.meta.url);
  return dirname(require.resolve(`${fontPackage}/LICENSE`));
}

/** The committed module path for a weight, relative to the repo root. */
export function fontModulePath(weight: number): string {
  return join(repoRoot, 'assets', 'fonts', `noto-sans-${weight}.ts`);
}

/**
 * WOFF 1.0 to sfnt (W3C WOFF File Format 1.0, sections 3-5): each table is zlib-compressed unless
 * its compressed length equals its original length. Table checksums are verified against the WOFF
 * directory, tables are laid out 4-byte aligned in directory order, and head.checkSumAdjustment is
 * recomputed for the new layout (OpenType spec, 'head' table).
 */
export function woffToSfnt(woff: Uint8Array): Uint8Array {
  const view = new DataView(woff.buffer, woff.byteOffset, woff.byteLength);
  if (view.getUint32(0) !== 0x774f4646) throw new Error('not a WOFF 1.0 file (signature is not wOFF)');
  const flavor = view.getUint32(4);
  const numTables = view.getUint16(12);

  const tables: Array<{ tag: string; checksum: number; data: Uint8Array }> = [];
  for (let i = 0; i < numTables; i++) {
    const entry = 44 + i * 20;
    const tag = String.fromCharCode(...woff.subarray(entry, entry + 4));
    const offset = view.getUint32(entry + 4);
    const compLength = view.getUint32(entry + 8);
    const origLength = view.getUint32(entry + 12);
    const origChecksum = view.getUint32(entry + 16);
    const stored = woff.subarray(offset, offset + compLength);
    const data = compLength === origLength ? stored.slice() : new Uint8Array(inflateSync(stored));
    if (data.length !== origLength) throw new Error(`table ${tag}: inflated ${data.length} bytes, expected ${origLength}`);
    const checksum = tableChecksum(tag === 'head' ? withZeroAdjustment(data) : data);
    if (checksum !== origChecksum) throw new Error(`table ${tag}: checksum ${checksum} does not match ${origChecksum}`);
    tables.push({ tag, checksum, data });
  }

  const headerLength = 12 + 16 * numTables;
  let totalLength = headerLength;
  for (const table of tables) totalLength += align4(table.data.length);
  const out = new Uint8Array(totalLength);
  const outView = new DataView(out.buffer);
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  outView.setUint32(0, flavor);
  outView.setUint16(4, numTables);
  outView.setUint16(6, searchRange);
  outView.setUint16(8, entrySelector);
  outView.setUint16(10, numTables * 16 - searchRange);

  let offset = headerLength;
  let headOffset = -1;
  tables.forEach((table, i) => {
    const record = 12 + i * 16;
    for (let k = 0; k < 4; k++) out[record + k] = table.tag.charCodeAt(k);
    outView.setUint32(record + 4, table.checksum);
    outView.setUint32(record + 8, offset);
    outView.setUint32(record + 12, table.data.length);
    out.set(table.data, offset);
    if (table.tag === 'head') headOffset = offset;
    offset += align4(table.data.length);
  });
  if (headOffset >= 0) {
    outView.setUint32(headOffset + 8, 0);
    outView.setUint32(headOffset + 8, (0xb1b0afba - tableChecksum(out)) >>> 0);
  }
  return out;
}

function align4(n: number): number {
  return (n + 3) & ~3;
}

function withZeroAdjustment(head: Uint8Array): Uint8Array {
  const copy = head.slice();
  copy.fill(0, 8, 12);
  return copy;
}

/** OpenType table checksum: sum of big-endian uint32 words, zero-padded, modulo 2^32. */
export function tableChecksum(data: Uint8Array): number {
  let sum = 0;
  for (let i = 0; i < data.length; i += 4) {
    const word = ((data[i] << 24) | ((data[i + 1] ?? 0) << 16) | ((data[i + 2] ?? 0) << 8) | (data[i + 3] ?? 0)) >>> 0;
    sum = (sum + word) >>> 0;
  }
  return sum;
}

/** The TypeScript text of the generated module for one weight. */
export function fontModuleSource(source: FontSource, woff: Uint8Array): string {
  const sfnt = woffToSfnt(woff);
  const base64 = Buffer.from(sfnt).toString('base64');
  const woffSha256 = createHash('sha256').update(woff).digest('hex');
  const lines: string[] = [];
  for (let i = 0; i < base64.length; i += 120) lines.push(`  '${base64.slice(i, i + 120)}',`);
  return [
    `// Generated by scripts/build-font-module.ts; do not edit. Noto Sans ${source.weight}, latin subset,`,
    `// from ${fontPackage} ${source.packageVersion} (files/${source.woffFileName}), decompressed from WOFF to sfnt.`,
    '// Licence: SIL Open Font License 1.1, see OFL.txt beside this file.',
    '',
    `export const notoSans${source.weight}Source = {`,
    `  package: '${fontPackage}',`,
    `  version: '${source.packageVersion}',`,
    `  file: '${source.woffFileName}',`,
    `  woffSha256: '${woffSha256}',`,
    `  sfntBytes: ${sfnt.length},`,
    '} as const;',
    '',
    `export const notoSans${source.weight}Base64 = [`,
    ...lines,
    "].join('');",
    '',
  ].join('\n');
}

function main(): void {
  const check = process.argv.includes('--check');
  let stale = 0;
  for (const weight of fontWeights) {
    const source = fontSource(weight);
    const text = fontModuleSource(source, new Uint8Array(readFileSync(source.woffPath)));
    const target = fontModulePath(weight);
    let current = '';
    try {
      current = readFileSync(target, 'utf8');
    } catch {
      // Missing module: written below, or reported as stale with --check.
    }
    if (current === text) continue;
    stale++;
    if (check) console.error(`stale: ${target}`);
    else writeFileSync(target, text);
  }
  if (!check) copyFileSync(join(fontPackageDir(), 'LICENSE'), join(repoRoot, 'assets', 'fonts', 'OFL.txt'));
  if (check && stale > 0) process.exit(1);
  console.log(check ? 'font modules are current' : `font modules written (${stale} changed)`);
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) main();
