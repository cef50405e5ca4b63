// Hostile corpus, outside references: no output file may carry a reference to anything outside itself
// (href other than a fragment, CSS url() or @import, scripts, event handlers, foreignObject), on every
// output path: correct, sheet, render and the app's export. The checks read the written text with
// plain patterns, not with the code under test. What counts as an outside reference follows SVG 2
// (§5.6 href on use/image/a, §15.4 event attributes, §15.5 script, §23.1 foreignObject) and CSS
// (Values and Units 3 §4.5 url(), Cascading 4 §2 @import).
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../../main/cli/index';
import { createHostHandlers, exportRefusal, type DialogPort } from '../../../main/electron/ipcHandlers';
import { createBrowserHost } from '../../../renderer/src/host/browserHost';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { findOutsideReferences, stripOutsideReferences } from '../../../shared-core/audit/outsideReferences';
import { renderChart } from '../../../shared-core/pipeline';
import { capture } from '../../helpers/cli';
import { chartDoc } from '../../helpers/chartDoc';
import { folderPerTest } from '../../helpers/tempDirs';

const work = folderPerTest('tallyglyph-outside-');

/** Two bars read by length (heights 20 and 40) with every kind of outside reference around them. */
const HOSTILE_SUPPLIED =
  '<?xml version="1.0" encoding="UTF-8"?>\n' +
  '<?xml-stylesheet type="text/css" href="http://evil.example/sheet.css"?>\n' +
  '<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" width="100mm" height="100mm" viewBox="0 0 100 100" onload="steal()" style="background-image: url(http://evil.example/bg.png)">' +
  '<style>@import url("http://evil.example/import.css"); .bar { fill: #335; } .deco { background: url(file:///etc/passwd) }</style>' +
  '<image href="file:///etc/passwd" x="80" y="0" width="10" height="10"/>' +
  '<image xlink:href="https://evil.example/pixel.png" x="80" y="20" width="1" height="1"/>' +
  '<use xlink:href="http://evil.example/remote.svg#shape"/>' +
  '<a href="javascript:steal()"><circle cx="90" cy="90" r="0.5" fill="none"/></a>' +
  '<script>fetch("file:///etc/passwd")</script>' +
  '<foreignObject width="10" height="10"><iframe xmlns="http://www.w3.org/1999/xhtml" src="file:///etc/passwd"/></foreignObject>' +
  '<set attributeName="xlink:href" to="http://evil.example/later.svg"/>' +
  '<rect id="a" class="bar" x="10" y="50" width="10" height="20" onclick="steal()"/>' +
  '<rect id="b" class="bar" x="40" y="30" width="10" height="40" style="fill:#335; filter: url(http://evil.example/f.svg#blur)"/>' +
  '</svg>\n';

/** Anything in the text that points outside: a web or file address, an import, a script, a handler, a foreign object. */
function outsideTraces(text: string): string[] {
  const withoutNamespaces = text.replace(/\sxmlns(?::\w+)?="[^"]*"/g, '');
  const patterns: [string, RegExp][] = [
    ['address', /(?:https?|file|javascript):/i],
    ['passwd', /passwd/],
    ['@import', /@import/i],
    ['outside url()', /url\(\s*['"]?(?!#)/i],
    ['script', /<script\b/i],
    ['event handler', /\son[a-z]+\s*=/i],
    ['foreignObject', /<foreignObject\b/i],
    ['style sheet link', /<\?xml-stylesheet/i],
  ];
  return patterns.filter(([, re]) => re.test(withoutNamespaces)).map(([name]) => name);
}

async function cli(args: string[]): Promise<{ code: number; out: string; err: string }> {
  const io = capture(work.dir);
  const code = await main(args, io);
  return { code, out: io.out, err: io.err };
}

describe('correct keeps nothing that reaches outside the file', () => {
  it('strips file: and web hrefs, CSS url() and @import, scripts, handlers and foreignObject, and says so', async () => {
    const input = path.join(work.dir, 'supplied.svg');
    fs.writeFileSync(input, HOSTILE_SUPPLIED);
    expect(outsideTraces(HOSTILE_SUPPLIED).length).toBeGreaterThanOrEqual(7); // the corpus really is hostile
    const r = await cli(['correct', input, '--values', '1,3', '-o', 'fixed.svg']);
    expect(r.code).toBe(0);
    const written = fs.readFileSync(path.join(work.dir, 'fixed.svg'), 'utf8');
    expect(outsideTraces(written)).toEqual([]);
    expect(r.out).toMatch(/Note: The corrected file leaves out .*links to outside files or addresses.*CSS @import.*a delivered file must not fetch or run anything/);
    // The marks are still there and now honest: 1 : 3 drawn as 20 : 60 high (length reading).
    const again = await cli(['audit', path.join(work.dir, 'fixed.svg'), '--values', '1,3', '--json']);
    const report = JSON.parse(again.out);
    expect(report.marks.map((m: { id: string }) => m.id)).toEqual(['a', 'b']);
    expect(report.readings.length.pass).toBe(true);
  });

  it('keeps fragment links and embedded raster images, and leaves a clean file byte for byte', () => {
    const png = 'data:image/png;base64,iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR4nGNgYGD4DwABBAEAwS2OUAAAAABJRU5ErkJggg==';
    const clean = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><defs><rect id="r" width="1" height="1"/></defs><use href="#r"/><image href="${png}" width="1" height="1"/><rect width="2" height="2" style="fill: url(#r)"/></svg>`;
    expect(findOutsideReferences(clean)).toEqual([]);
    expect(stripOutsideReferences(clean).svg).toBe(clean);
  });

  it('sees references hidden by CSS escapes and entities, and an embedded SVG that could carry its own', () => {
    const tricky = [
      '<svg xmlns="http://www.w3.org/2000/svg"><style>.x { background: \\75 rl(http://evil.example/a.png) }</style></svg>',
      '<svg xmlns="http://www.w3.org/2000/svg"><a href="&#x6A;avascript:alert(1)"/></svg>',
      '<svg xmlns="http://www.w3.org/2000/svg"><image href="data:image/svg+xml;base64,PHN2Zy8+"/></svg>',
      '<svg xmlns="http://www.w3.org/2000/svg"><style><![CDATA[@import "http://evil.example/a.css";]]></style></svg>',
      '<svg xmlns="http://www.w3.org/2000/svg"><g xml:base="http://evil.example/"><use href="#a"/></g></svg>',
      '<!DOCTYPE svg SYSTEM "file:///etc/passwd"><svg xmlns="http://www.w3.org/2000/svg"/>',
    ];
    for (const text of tricky) {
      expect(findOutsideReferences(text).length).toBeGreaterThan(0);
      const out = stripOutsideReferences(text).svg;
      expect(findOutsideReferences(out)).toEqual([]);
      expect(out).not.toMatch(/evil|passwd|6A;avascript|svg\+xml/);
    }
  });
});

describe('sheet keeps nothing that reaches outside the file', () => {
  it('the sheet SVG carries none of the supplied references, with a note', async () => {
    const input = path.join(work.dir, 'supplied.svg');
    fs.writeFileSync(input, HOSTILE_SUPPLIED);
    const r = await cli(['sheet', input, '--values', '1,3', '-o', 'sheet.svg']);
    expect(r.code).toBe(0);
    const written = fs.readFileSync(path.join(work.dir, 'sheet.svg'), 'utf8');
    expect(outsideTraces(written)).toEqual([]);
    expect(r.out).toMatch(/Note: The sheet's copy leaves out/);
  });

  it('a style attribute with url() and an @import in the supplied file do not reach the sheet', async () => {
    const input = path.join(work.dir, 'css.svg');
    fs.writeFileSync(
      input,
      '<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm" viewBox="0 0 100 100">' +
        '<style>@import url(http://evil.example/x.css);</style>' +
        '<rect id="a" x="10" y="50" width="10" height="20" style="fill:#335;mask:url(http://evil.example/m.svg#m)"/>' +
        '<rect id="b" x="40" y="30" width="10" height="40" fill="#335"/></svg>',
    );
    const r = await cli(['sheet', input, '--values', '1,3', '-o', 'sheet.svg']);
    expect(r.code).toBe(0);
    expect(outsideTraces(fs.readFileSync(path.join(work.dir, 'sheet.svg'), 'utf8'))).toEqual([]);
  });
});

describe('render and app export carry no outside reference', () => {
  it('an inline glyph full of references is drawn as plain outlines', () => {
    const glyph =
      '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><style>@import url(http://evil.example/a.css);</style>' +
      '<image href="file:///etc/passwd" width="10" height="10"/><script>steal()</script>' +
      '<rect x="1" y="1" width="8" height="8" onclick="steal()" style="fill:#000;filter:url(http://evil.example/f)"/></svg>';
    const { svg } = renderChart(chartDoc({ encoding: { mode: 'repeat', glyph: { svg: glyph }, unit: 10 } }));
    expect(outsideTraces(svg.replace(/<!DOCTYPE[^[]*\[/, ''))).toEqual([]);
    expect(findOutsideReferences(svg)).toEqual([]);
  });

  const honest = renderChart(DEMO_CHARTS[0].document).svg;
  const inside = (fragment: string) => honest.replace(/(<svg\b[^>]*>)/, `$1${fragment}`);
  const cssCases: [string, string][] = [
    ['a CSS @import', '<style>@import url(http://evil.example/a.css);</style>'],
    ['a CSS url() in a style attribute', '<g style="background:url(file:///etc/passwd)"/>'],
    ['a CSS url() in a presentation attribute', '<rect width="1" height="1" fill="url(http://evil.example/p.svg#p)"/>'],
  ];

  it('the honest chart passes the export checks as written', () => {
    expect(exportRefusal(honest)).toBeNull();
    expect(findOutsideReferences(honest)).toEqual([]);
  });

  for (const [what, fragment] of cssCases) {
    it(`the Electron export refuses ${what} and writes nothing`, async () => {
      const svg = inside(fragment);
      expect(exportRefusal(svg)).toMatch(/^Not exported: The SVG refers outside itself: 1 CSS/);
      const target = path.join(work.dir, 'out.svg');
      const dialogs: DialogPort = { chooseOpenPath: async () => null, chooseSavePath: async () => target };
      const handlers = createHostHandlers({ dialogs, recentFile: path.join(work.dir, 'recent.json') });
      const r = (await handlers.exportSvg({ svg, suggestedName: 'chart.svg' })) as { ok: boolean; error?: { code: string } };
      expect(r.ok).toBe(false);
      expect(r.error?.code).toBe('gate-refused');
      expect(fs.existsSync(target)).toBe(false);
    });

    it(`the browser host refuses ${what} before downloading`, async () => {
      const host = createBrowserHost({ storage: null });
      const r = await host.exportSvg({ svg: inside(fragment), suggestedName: 'chart.svg' });
      expect(r.ok).toBe(false);
      expect(!r.ok && r.error.code).toBe('gate-refused');
      expect(!r.ok && r.error.message).toMatch(/refers outside itself/);
    });
  }
});
