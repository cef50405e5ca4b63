// The honesty table's "show me this category": the marks of one label located in the written SVG and
// drawn again over a dimmed page, as a second picture laid exactly over the preview. The preview itself
// stays the untouched exported file.
import svgpath from 'svgpath';

export interface BoxUnits {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface MarkOverlay {
  /** An SVG of the same page size and viewBox as the chart: the page dimmed, the category's marks on top, a frame around them. */
  svg: string;
  /** The marks' bounding box in the chart's user units (mm). */
  box: BoxUnits;
  /** The chart's viewBox, to turn the box into a share of the page. */
  viewBox: BoxUnits;
  markCount: number;
}

const SVG_NS = 'http://www.w3.org/2000/svg';
const XLINK_NS = 'http://www.w3.org/1999/xlink';
const FRAME_COLOUR = '#1e6b58';

function growBox(box: BoxUnits | null, x: number, y: number): BoxUnits {
  if (!box) return { x, y, width: 0, height: 0 };
  const x0 = Math.min(box.x, x);
  const y0 = Math.min(box.y, y);
  return { x: x0, y: y0, width: Math.max(box.x + box.width, x) - x0, height: Math.max(box.y + box.height, y) - y0 };
}

/** Bounds of path data moved by (dx, dy); control points included, so never too small. */
function pathBox(d: string, dx: number, dy: number, box: BoxUnits | null): BoxUnits | null {
  let out = box;
  try {
    svgpath(d)
      .abs()
      .unarc()
      .iterate((segment) => {
        for (let i = 1; i + 1 < segment.length; i += 2) out = growBox(out, Number(segment[i]) + dx, Number(segment[i + 1]) + dy);
      });
  } catch {
    // Unreadable path data adds nothing to the frame; the picture itself is the file's.
  }
  return out;
}

/** Overlay for the marks labelled `label` in a chart SVG written by Tallyglyph, or null when it has none. */
export function markOverlay(svgText: string, label: string): MarkOverlay | null {
  const parsed = new DOMParser().parseFromString(svgText, 'image/svg+xml');
  const root = parsed.documentElement;
  if (parsed.getElementsByTagName('parsererror').length > 0 || root.localName !== 'svg') return null;
  const marks = Array.from(root.getElementsByTagNameNS(SVG_NS, 'g')).filter((g) => g.classList.contains('tg-mark') && g.getAttribute('data-label') === label);
  if (marks.length === 0) return null;
  const vb = (root.getAttribute('viewBox') ?? '').trim().split(/[\s,]+/).map(Number);
  if (vb.length !== 4 || !vb.every(Number.isFinite)) return null;
  const viewBox = { x: vb[0], y: vb[1], width: vb[2], height: vb[3] };

  let box: BoxUnits | null = null;
  for (const mark of marks) {
    for (const el of Array.from(mark.querySelectorAll('path, use'))) {
      if (el.localName === 'path') box = pathBox(el.getAttribute('d') ?? '', 0, 0, box);
      else {
        const href = el.getAttributeNS(XLINK_NS, 'href') ?? el.getAttribute('href') ?? '';
        const target = href.startsWith('#') ? parsed.getElementById(href.slice(1)) : null;
        const dx = Number(el.getAttribute('x') ?? 0);
        const dy = Number(el.getAttribute('y') ?? 0);
        if (target?.localName === 'path') box = pathBox(target.getAttribute('d') ?? '', dx, dy, box);
      }
    }
  }
  if (!box) return null;

  const out = document.implementation.createDocument(SVG_NS, 'svg', null);
  const svg = out.documentElement;
  for (const name of ['width', 'height', 'viewBox']) svg.setAttribute(name, root.getAttribute(name) ?? '');
  svg.setAttribute('version', '1.1');
  svg.setAttributeNS('http://www.w3.org/2000/xmlns/', 'xmlns:xlink', XLINK_NS);
  const defs = root.getElementsByTagNameNS(SVG_NS, 'defs')[0];
  if (defs) svg.appendChild(out.importNode(defs, true));
  const dim = out.createElementNS(SVG_NS, 'rect');
  for (const [k, v] of Object.entries({ x: viewBox.x, y: viewBox.y, width: viewBox.width, height: viewBox.height, fill: '#ffffff', 'fill-opacity': 0.72 })) dim.setAttribute(k, String(v));
  svg.appendChild(dim);
  for (const mark of marks) svg.appendChild(out.importNode(mark, true));
  // A frame a little outside the marks, its line width a share of the page so it reads at any zoom.
  const pad = Math.max(viewBox.width, viewBox.height) * 0.012;
  const frame = out.createElementNS(SVG_NS, 'rect');
  const stroke = Math.max(viewBox.width, viewBox.height) * 0.003;
  for (const [k, v] of Object.entries({ x: box.x - pad, y: box.y - pad, width: box.width + 2 * pad, height: box.height + 2 * pad, rx: pad / 2, fill: 'none', stroke: FRAME_COLOUR, 'stroke-width': stroke, 'stroke-dasharray': `${stroke * 3} ${stroke * 2}` })) frame.setAttribute(k, String(v));
  svg.appendChild(frame);
  return { svg: new XMLSerializer().serializeToString(out), box, viewBox, markCount: marks.length };
}

/** The page size the root <svg> declares, in mm; null when it is not in mm (the chart writer always uses mm). */
export function pageSizeMm(svgText: string): { widthMm: number; heightMm: number } | null {
  const root = /<svg\b[^>]*>/.exec(svgText)?.[0] ?? '';
  const w = /\swidth="([\d.]+)mm"/.exec(root);
  const h = /\sheight="([\d.]+)mm"/.exec(root);
  const widthMm = w ? Number(w[1]) : NaN;
  const heightMm = h ? Number(h[1]) : NaN;
  return widthMm > 0 && heightMm > 0 ? { widthMm, heightMm } : null;
}
