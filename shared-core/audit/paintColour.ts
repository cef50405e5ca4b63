// The fill colour a shape is painted with, resolved along its element chain (fill is inherited),
// for telling shaded faces apart and for the report. Only plain colours are read.
import type { XmlElement } from '../svg/parseXml';

export interface Rgb {
  r: number;
  g: number;
  b: number;
}

/** CSS basic colour keywords (CSS Color Module Level 3, §4.1). */
const NAMED: Record<string, string> = {
  black: '#000000', silver: '#c0c0c0', gray: '#808080', grey: '#808080', white: '#ffffff', maroon: '#800000', red: '#ff0000',
  purple: '#800080', fuchsia: '#ff00ff', green: '#008000', lime: '#00ff00', olive: '#808000', yellow: '#ffff00', navy: '#000080',
  blue: '#0000ff', teal: '#008080', aqua: '#00ffff', orange: '#ffa500', brown: '#a52a2a',
};

function declared(el: XmlElement, prop: string): string | undefined {
  const st = el.attrs.style;
  if (st) {
    for (const decl of st.split(';')) {
      const i = decl.indexOf(':');
      if (i > 0 && decl.slice(0, i).trim().toLowerCase() === prop) return decl.slice(i + 1).replace(/!important/i, '').trim();
    }
  }
  return el.attrs[prop];
}

/** Parse #rgb, #rrggbb, rgb(r, g, b) or a basic keyword; null for anything else (gradients, currentColor). */
export function parseColour(text: string | undefined): Rgb | null {
  if (!text) return null;
  let s = text.trim().toLowerCase();
  if (NAMED[s]) s = NAMED[s];
  let m = /^#([0-9a-f])([0-9a-f])([0-9a-f])$/.exec(s);
  if (m) return { r: parseInt(m[1] + m[1], 16), g: parseInt(m[2] + m[2], 16), b: parseInt(m[3] + m[3], 16) };
  m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/.exec(s);
  if (m) return { r: parseInt(m[1], 16), g: parseInt(m[2], 16), b: parseInt(m[3], 16) };
  m = /^rgba?\(\s*(\d+(?:\.\d+)?)(%?)\s*,?\s*(\d+(?:\.\d+)?)(%?)\s*,?\s*(\d+(?:\.\d+)?)(%?)/.exec(s);
  if (m) {
    const ch = (v: string, pct: string) => Math.max(0, Math.min(255, pct ? (Number(v) * 255) / 100 : Number(v)));
    return { r: ch(m[1], m[2]), g: ch(m[3], m[4]), b: ch(m[5], m[6]) };
  }
  return null;
}

/** The fill colour in effect at the end of the chain; SVG's initial fill is black. */
export function fillColourOf(chain: readonly XmlElement[]): Rgb | null {
  for (let i = chain.length - 1; i >= 0; i--) {
    const v = declared(chain[i], 'fill');
    if (v !== undefined && v !== 'inherit' && v !== '') return parseColour(v);
  }
  return { r: 0, g: 0, b: 0 };
}

export function colourKey(c: Rgb): string {
  const h = (v: number) => Math.round(v).toString(16).padStart(2, '0');
  return `#${h(c.r)}${h(c.g)}${h(c.b)}`;
}

/** Hue (degrees), saturation and lightness (0..1), per the HSL definition in CSS Color Module Level 3 §4.2.4. */
export function toHsl(c: Rgb): { h: number; s: number; l: number } {
  const r = c.r / 255, g = c.g / 255, b = c.b / 255;
  const max = Math.max(r, g, b), min = Math.min(r, g, b);
  const l = (max + min) / 2;
  if (max === min) return { h: 0, s: 0, l };
  const d = max - min;
  const s = l > 0.5 ? d / (2 - max - min) : d / (max + min);
  let h: number;
  if (max === r) h = ((g - b) / d + (g < b ? 6 : 0)) * 60;
  else if (max === g) h = ((b - r) / d + 2) * 60;
  else h = ((r - g) / d + 4) * 60;
  return { h, s, l };
}
