// A clean copy of a supplied drawing, for placing it on a sheet: re-serialised from the parsed tree
// without scripts, event handlers, foreign objects, style sheets, editor metadata or references to
// anything outside the file, and with every id prefixed so two copies can share one document.
import { escapeXmlAttr, escapeXmlText } from '../svg/writeSvg';
import type { XmlElement } from '../svg/parseXml';
import type { Warning } from '../errors';
import { cleanCss } from './outsideReferences';
import { INITIAL_TEXT_STYLE, MAX_OUTLINED_CHARACTERS, inheritTextStyle, outlineSuppliedText, textNotShownNote, type InheritedTextStyle, type TextNotShown } from './outlineSuppliedText';

const DROPPED = new Set(['script', 'foreignObject', 'style', 'iframe', 'handler', 'listener']);
const ROOT_ONLY = new Set(['width', 'height', 'viewBox', 'x', 'y', 'version', 'preserveAspectRatio', 'baseProfile', 'zoomAndPan', 'contentScriptType', 'contentStyleType', 'id']);
/** Positioning attributes of a <text> that mean nothing on the group that replaces it. */
const TEXT_POSITION = new Set(['x', 'y', 'dx', 'dy', 'rotate', 'textLength', 'lengthAdjust']);
const SAFE_DATA_URL = /^data:image\/(png|jpeg|jpg|gif|webp)[;,]/i;

export interface SanitizedCopy {
  /** Children of the root, cleaned, as SVG markup. */
  markup: string;
  /** The root's own presentation attributes (fill, transform, style ...), cleaned, as an attribute string for a <g>. */
  rootAttributes: string;
  /** Text of the drawing that could not be drawn as outlines in a bundled font, and was left out. */
  textNotShown: TextNotShown[];
  warnings: Warning[];
}

export interface SanitizedCopyOptions {
  /**
   * Draw <text> as outlines in the bundled Noto Sans (a sheet, which must look the same in every viewer
   * and in its PNG); text it cannot draw so is left out and listed. Default false: text stays live text.
   */
  outlineText?: boolean;
}

export function sanitizedCopy(root: XmlElement, idPrefix: string, options: SanitizedCopyOptions = {}): SanitizedCopy {
  const dropped = new Map<string, number>();
  const note = (what: string) => dropped.set(what, (dropped.get(what) ?? 0) + 1);
  const rewrite = (value: string) =>
    value.replace(/url\(\s*(['"]?)#([^)'"\s]+)\1\s*\)/g, (_m, _q, id: string) => `url(#${idPrefix}${id})`);

  const attributes = (el: XmlElement, skip: ReadonlySet<string>): string => {
    let out = '';
    for (const [k, v] of Object.entries(el.attrs)) {
      if (skip.has(k)) continue;
      if (/^on/i.test(k)) {
        note('event handlers');
        continue;
      }
      if (k === 'xmlns' || k.startsWith('xmlns:')) continue;
      const colon = k.indexOf(':');
      if (colon >= 0 && k !== 'xlink:href' && k !== 'xml:space') continue;
      let value = v;
      if (k === 'href' || k === 'xlink:href') {
        const href = v.trim();
        if (href.startsWith('#')) value = `#${idPrefix}${href.slice(1)}`;
        else if (!SAFE_DATA_URL.test(href)) {
          note('outside references');
          continue;
        }
        out += ` href="${escapeXmlAttr(value)}"`;
        continue;
      }
      if (k === 'src' && !SAFE_DATA_URL.test(v.trim())) {
        note('outside references');
        continue;
      }
      if (/url\(|@import|image(?:-set)?\(|\\/i.test(v)) {
        // CSS in a style or presentation attribute may point outside the file too.
        const cleaned = cleanCss(v);
        if (cleaned.urls + cleaned.imports > 0) {
          note('CSS references to outside files');
          if (k !== 'style' || cleaned.css.trim() === '') continue;
          value = cleaned.css;
        }
      }
      if (k === 'id') value = idPrefix + v;
      else value = rewrite(value);
      out += ` ${k}="${escapeXmlAttr(value)}"`;
    }
    return out;
  };

  const textNotShown: TextNotShown[] = [];
  let outlinedTexts = 0;
  const outlineBudget = { characters: MAX_OUTLINED_CHARACTERS };
  const write = (el: XmlElement, parentStyle: InheritedTextStyle): string => {
    if (DROPPED.has(el.name)) {
      note(`<${el.name}> elements`);
      return '';
    }
    // Editor namespaces (inkscape:, sodipodi:) carry nothing to draw.
    if (el.qname.includes(':') && !el.qname.startsWith('svg:')) return '';
    const style = inheritTextStyle(parentStyle, el);
    if (el.name === 'text' && options.outlineText) {
      // Live text would need the drawing's fonts in every viewer and in the PNG renderer: outline it.
      // A text without an id gets one, so a checker can hide the words and measure the marks alone.
      const idOf = (e: XmlElement) => (e === el && e.attrs.id === undefined ? ` id="${escapeXmlAttr(`${idPrefix}outlined-text-${++outlinedTexts}`)}"` : '');
      const outlined = outlineSuppliedText(el, style, (e) => idOf(e) + attributes(e, TEXT_POSITION), outlineBudget);
      if (outlined.kind === 'outlined') return outlined.markup;
      if (outlined.kind === 'not-shown') textNotShown.push(outlined.notShown);
      return '';
    }
    // The parsed tree keeps an element's own text apart from its children; text first is the usual order.
    const inner = (el.text ? escapeXmlText(el.text) : '') + el.children.map((c) => write(c, style)).join('');
    const attrs = attributes(el, new Set());
    return inner ? `<${el.name}${attrs}>${inner}</${el.name}>` : `<${el.name}${attrs}/>`;
  };

  const rootStyle = inheritTextStyle(INITIAL_TEXT_STYLE, root);
  const markup = root.children.map((c) => write(c, rootStyle)).join('');
  const rootAttributes = attributes(root, ROOT_ONLY);
  const warnings: Warning[] = [...dropped.entries()].map(([what, n]) => ({ code: 'sheet-dropped', message: `The sheet's copy leaves out ${n} ${what} from the supplied file.` }));
  const textNote = textNotShownNote(textNotShown);
  if (textNote) warnings.push({ code: 'sheet-text-not-shown', message: textNote });
  return { markup, rootAttributes, textNotShown, warnings };
}
