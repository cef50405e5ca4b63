// Hostile supplied files. Each must end in a clear refusal naming the rule or limit, or in a safe
// result, within bounded time, never a crash (exit 3 means an unexpected failure), and never with a
// local file's contents in any output. The secret lives in temp files that the hostile inputs point at.
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../../main/cli/index';
import { readSuppliedFile } from '../../../main/audit/readSupplied';
import { pngCrc32 } from '../../../main/raster/physChunk';
import { PNG } from 'pngjs';

const SECRET = `TG-SECRET-${randomBytes(8).toString('hex')}`;
let dir = '';
let secretTxt = '';
let secretSvg = '';

beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-hostile-'));
  secretTxt = path.join(dir, 'private.txt');
  fs.writeFileSync(secretTxt, `${SECRET}\n`);
  secretSvg = path.join(dir, 'private.svg');
  fs.writeFileSync(secretSvg, `<svg xmlns="http://www.w3.org/2000/svg"><g id="x"><rect width="500" height="500"/><title>${SECRET}</title></g></svg>`);
});
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

const TWO_MARKS = '<rect id="a" x="10" y="50" width="10" height="20"/><rect id="b" x="40" y="30" width="10" height="40"/>';
const svg = (body: string, head = '') => `${head}<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" width="100mm" height="100mm" viewBox="0 0 100 100">${body}</svg>`;

interface Run {
  code: number;
  out: string;
  err: string;
  ms: number;
}

async function run(name: string, content: string | Uint8Array, args: string[] = ['--values', '1,2']): Promise<Run> {
  const file = path.join(dir, name);
  fs.writeFileSync(file, content);
  let out = '', err = '';
  const io = { stdout: (s: string) => void (out += s), stderr: (s: string) => void (err += s), cwd: dir };
  const t0 = Date.now();
  const code = await main(['audit', file, ...args, '--json'], io);
  const ms = Date.now() - t0;
  // Never the secret, whatever happened.
  expect(out + err).not.toContain(SECRET);
  expect(code).not.toBe(3);
  return { code, out, err, ms };
}

function refused(r: Run, pattern: RegExp): void {
  expect(r.code).toBe(2);
  expect(r.out).toBe('');
  expect(r.err).toMatch(pattern);
}

describe('audit of hostile SVG', () => {
  it('an external entity reading a local file is refused before any parsing (no DTD entities)', async () => {
    const r = await run('xxe.svg', svg(`${TWO_MARKS}<text x="1" y="9">&xxe;</text>`, `<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY xxe SYSTEM "file://${secretTxt}">]>`));
    refused(r, /declares or uses XML entities/);
  });

  it('an entity expansion bomb is refused at once', async () => {
    let dtd = '<!ENTITY l0 "lol">';
    for (let i = 1; i < 10; i++) dtd += `<!ENTITY l${i} "${`&l${i - 1};`.repeat(10)}">`;
    const r = await run('bomb.svg', svg('<text>&l9;</text>' + TWO_MARKS, `<!DOCTYPE svg [${dtd}]>`));
    refused(r, /entities/);
    expect(r.ms).toBeLessThan(2000);
  });

  it('a script element, event handlers and a foreignObject are ignored with a warning; the marks are still audited', async () => {
    const body =
      `<script>fetch("file://${secretTxt}")</script>` +
      `<g onload="alert(1)" onclick="x()">${TWO_MARKS}</g>` +
      `<foreignObject width="100" height="100"><iframe xmlns="http://www.w3.org/1999/xhtml" src="file://${secretTxt}"/></foreignObject>`;
    const r = await run('script.svg', svg(body));
    expect(r.code).toBe(0);
    const report = JSON.parse(r.out);
    const codes = report.warnings.map((w: { code: string }) => w.code);
    expect(codes).toEqual(expect.arrayContaining(['script-ignored', 'event-handler-ignored', 'foreign-object-ignored']));
    expect(report.marks.length).toBe(2);
  });

  it('external, file: and network hrefs are never fetched: they add no ink and no content', async () => {
    const body =
      TWO_MARKS +
      `<use xlink:href="file://${secretSvg}#x"/><use href="${secretSvg}#x"/><use href="http://127.0.0.1:9/remote.svg#x"/>` +
      `<image href="file://${secretTxt}" width="100" height="100"/>`;
    const r = await run('hrefs.svg', svg(body));
    expect(r.code).toBe(0);
    const report = JSON.parse(r.out);
    // Had private.svg been read, its 500 × 500 rectangle would be a third mark.
    expect(report.marks.map((m: { inkAreaUnits2: number }) => m.inkAreaUnits2)).toEqual([200, 400]);
    expect(report.warnings.map((w: { code: string }) => w.code)).toContain('external-reference-ignored');
  });

  it('a self-referencing use and a use cycle are refused as a reference cycle', async () => {
    refused(await run('self.svg', svg(TWO_MARKS + '<use id="u" href="#u"/>')), /reference cycle/);
    refused(await run('cycle.svg', svg(TWO_MARKS + '<g id="p"><use href="#q"/></g><g id="q"><use href="#p"/></g>')), /reference cycle/);
  });

  it('a use chain 10,000 deep is refused by the use depth limit, quickly', async () => {
    let body = '<defs><rect id="u0" width="1" height="1"/>';
    for (let i = 1; i <= 10_000; i++) body += `<use id="u${i}" href="#u${i - 1}"/>`;
    const r = await run('chain.svg', svg(body + '</defs><use href="#u10000"/>' + TWO_MARKS));
    refused(r, /use depth limit/);
    expect(r.ms).toBeLessThan(3000);
  });

  it('a fan-out of references that paints nothing (10 uses of 10 uses ... 8 deep) is refused by the expanded element limit', async () => {
    let body = '<defs><g id="f0"/>';
    for (let i = 1; i <= 8; i++) body += `<g id="f${i}">${`<use href="#f${i - 1}"/>`.repeat(10)}</g>`;
    const r = await run('fanout.svg', svg(body + '</defs><use href="#f8"/>' + TWO_MARKS));
    refused(r, /expanded element limit/);
    expect(r.ms).toBeLessThan(3000);
  });

  it('a path of a million commands is refused by the path command limit', async () => {
    const d = 'M0 0' + ' L1 1'.repeat(1_000_000);
    const r = await run('million.svg', svg(`<path d="${d}"/>` + TWO_MARKS));
    refused(r, /path command limit/);
    expect(r.ms).toBeLessThan(5000);
  });

  it('a 50 MB file is refused by the file size limit before it is read', async () => {
    const file = path.join(dir, 'huge.svg');
    fs.writeFileSync(file, svg(TWO_MARKS));
    fs.truncateSync(file, 50_000_000);
    let err = '';
    const t0 = Date.now();
    const code = await main(['audit', file, '--values', '1,2'], { stdout: () => undefined, stderr: (s) => void (err += s), cwd: dir });
    expect(code).toBe(2);
    expect(err).toMatch(/50\.0 MB; the file size limit for a supplied graphic is 16\.0 MB/);
    expect(Date.now() - t0).toBeLessThan(1000);
  });

  it('truncated XML, non-UTF-8 bytes and elements nested past the depth limit are refused', async () => {
    const whole = svg(TWO_MARKS);
    refused(await run('cut.svg', whole.slice(0, whole.length - 20)), /not well-formed XML/);
    const latin1 = Buffer.concat([Buffer.from(svg(TWO_MARKS + '<title>Caf')), Buffer.from([0xe9]), Buffer.from('</title></svg>')]);
    refused(await run('latin1.svg', latin1), /not valid UTF-8/);
    refused(await run('deep.svg', svg('<g>'.repeat(400) + '</g>'.repeat(400) + TWO_MARKS)), /depth limit/);
  });

  it('an SVG that paints nothing is refused with a plain reason', async () => {
    refused(await run('empty.svg', svg('<rect width="0" height="5"/>')), /paints nothing/);
  });
});

describe('audit of hostile images', () => {
  const goodPng = () => {
    const p = new PNG({ width: 4, height: 4 });
    p.data.fill(255);
    return PNG.sync.write(p);
  };

  it('a PNG with a wrong CRC is refused before decoding', async () => {
    const bytes = Buffer.from(goodPng());
    bytes[bytes.length - 13] ^= 0xff; // a byte of IDAT's or IEND's CRC region
    bytes[29] ^= 0x01; // IHDR's CRC (bytes 29..32)
    refused(await run('crc.png', bytes, ['--values', '1']), /checksum \(CRC\)/);
  });

  it('a zero-size PNG (width 0, valid CRCs), an empty file and a JPEG with no frame are refused', async () => {
    const bytes = Buffer.from(goodPng());
    bytes.writeUInt32BE(0, 16); // IHDR width
    bytes.writeUInt32BE(pngCrc32(bytes.subarray(12, 29)), 29);
    refused(await run('zero.png', bytes, ['--values', '1']), /impossible size \(0 x 4 pixels\)/);
    refused(await run('empty.png', new Uint8Array(0), ['--values', '1']), /empty \(0 bytes\)/);
    refused(await run('cut.jpg', new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 16, 74, 70, 73, 70, 0]), ['--values', '1']), /JPEG file is cut short or damaged/);
  });

  it('a white image has no marks and says so', async () => {
    refused(await run('white.png', goodPng(), ['--values', '1']), /Nothing in the image differs from the background/);
  });

  it('readSuppliedFile names the file, never its contents, when it cannot be read as a graphic', () => {
    expect(() => readSuppliedFile(secretTxt)).toThrow(/"private\.txt" is not an SVG, PNG or JPEG file/);
  });
});
