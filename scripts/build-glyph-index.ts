// Builds assets/glyphs/glyphs.json, the bundled glyph catalog, from filled Phosphor icons in
// node_modules. Run with `npm run build:glyphs` (`--check` exits 1 when the committed index or
// licence copy is stale instead of writing them).
//
// Names, tags and categories are ours; `source` keeps the upstream file name for traceability.
// Each icon is reduced to a root <svg> and its <path>s, measured with measureGlyph, and refused
// (the build fails) when the measurement warns, so every bundled glyph has an exact ink area.

import { copyFileSync, readFileSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { measureGlyph } from '../shared-core/glyph';
import { parseXml, type XmlElement } from '../shared-core/svg';

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const iconPackage = '@phosphor-icons/core';

export const GLYPH_INDEX_FORMAT = 'tallyglyph.glyphs/1';
export const glyphIndexPath = join(repoRoot, 'assets', 'glyphs', 'glyphs.json');
export const licenceFileName = 'LICENSE-phosphor.txt';
export const licenceCopyPath = join(repoRoot, 'assets', 'glyphs', licenceFileName);

/** Decimals kept for measured lengths and areas (glyph units) and for the dimensionless box fraction. */
export const UNIT_DECIMALS = 4;
export const FRACTION_DECIMALS = 6;

export const glyphCategories = [
  'people', 'animals', 'transport', 'buildings', 'food', 'nature', 'money', 'devices', 'energy', 'health', 'education', 'shapes',
] as const;
export type GlyphCategoryName = (typeof glyphCategories)[number];

export interface GlyphChoice {
  name: string;
  category: GlyphCategoryName;
  tags: string[];
  /** Upstream file name in the package's assets/fill folder. */
  source: string;
}

const pick = (name: string, category: GlyphCategoryName, upstream: string, tags: string[]): GlyphChoice => ({
  name,
  category,
  tags,
  source: `${upstream}-fill.svg`,
});

export const glyphChoices: GlyphChoice[] = [
  pick('person', 'people', 'person', ['human', 'adult', 'individual']),
  pick('stick-figure', 'people', 'person-simple', ['person', 'standing', 'human']),
  pick('walker', 'people', 'person-simple-walk', ['person', 'walking', 'pedestrian']),
  pick('runner', 'people', 'person-simple-run', ['person', 'running', 'sport']),
  pick('user', 'people', 'user', ['person', 'profile', 'account']),
  pick('pair', 'people', 'users', ['people', 'two', 'couple']),
  pick('group', 'people', 'users-three', ['people', 'team', 'crowd']),
  pick('family', 'people', 'users-four', ['people', 'household', 'four']),
  pick('baby', 'people', 'baby', ['child', 'infant', 'newborn']),
  pick('wheelchair', 'people', 'wheelchair', ['disability', 'accessibility', 'person']),
  pick('student', 'people', 'student', ['person', 'school', 'pupil']),

  pick('cat', 'animals', 'cat', ['pet', 'animal', 'kitten']),
  pick('dog', 'animals', 'dog', ['pet', 'animal', 'puppy']),
  pick('bird', 'animals', 'bird', ['animal', 'wildlife', 'flying']),
  pick('fish', 'animals', 'fish', ['animal', 'sea', 'seafood']),
  pick('horse', 'animals', 'horse', ['animal', 'farm', 'equine']),
  pick('cow', 'animals', 'cow', ['animal', 'farm', 'cattle', 'dairy']),
  pick('rabbit', 'animals', 'rabbit', ['animal', 'pet', 'bunny']),
  pick('butterfly', 'animals', 'butterfly', ['insect', 'animal', 'wildlife']),
  pick('paw', 'animals', 'paw-print', ['pet', 'animal', 'footprint']),

  pick('bike', 'transport', 'bicycle', ['bicycle', 'cycling', 'cycle']),
  pick('bus', 'transport', 'bus', ['transit', 'coach', 'public']),
  pick('car', 'transport', 'car', ['vehicle', 'automobile', 'driving']),
  pick('train', 'transport', 'train', ['rail', 'railway', 'transit']),
  pick('plane', 'transport', 'airplane', ['airplane', 'aircraft', 'flight']),
  pick('boat', 'transport', 'boat', ['ship', 'ferry', 'sea']),
  pick('truck', 'transport', 'truck', ['lorry', 'freight', 'delivery']),
  pick('scooter', 'transport', 'scooter', ['micromobility', 'kick', 'ride']),
  pick('motorbike', 'transport', 'motorcycle', ['motorcycle', 'motor', 'ride']),
  pick('taxi', 'transport', 'taxi', ['cab', 'car', 'ride']),
  pick('tram', 'transport', 'tram', ['streetcar', 'rail', 'transit']),
  pick('tractor', 'transport', 'tractor', ['farm', 'agriculture', 'vehicle']),

  pick('house', 'buildings', 'house', ['home', 'housing', 'dwelling']),
  pick('factory', 'buildings', 'factory', ['industry', 'manufacturing', 'plant']),
  pick('hospital', 'buildings', 'hospital', ['health', 'clinic', 'care']),
  pick('office', 'buildings', 'building-office', ['work', 'business', 'building']),
  pick('apartment', 'buildings', 'building-apartment', ['flats', 'housing', 'residential']),
  pick('store', 'buildings', 'storefront', ['shop', 'retail', 'market']),
  pick('warehouse', 'buildings', 'warehouse', ['storage', 'logistics', 'depot']),
  pick('church', 'buildings', 'church', ['religion', 'worship', 'chapel']),
  pick('barn', 'buildings', 'barn', ['farm', 'agriculture', 'rural']),
  pick('bank', 'buildings', 'bank', ['finance', 'money', 'building']),

  pick('avocado', 'food', 'avocado', ['fruit', 'vegetable']),
  pick('bread', 'food', 'bread', ['bakery', 'toast', 'loaf']),
  pick('carrot', 'food', 'carrot', ['vegetable', 'root']),
  pick('coffee', 'food', 'coffee', ['drink', 'cup', 'cafe']),
  pick('egg', 'food', 'egg', ['breakfast', 'protein']),
  pick('burger', 'food', 'hamburger', ['hamburger', 'fast-food', 'meal']),
  pick('pizza', 'food', 'pizza', ['fast-food', 'meal', 'slice']),
  pick('orange', 'food', 'orange', ['fruit', 'citrus']),
  pick('wine', 'food', 'wine', ['drink', 'alcohol', 'glass']),
  pick('beer', 'food', 'pint-glass', ['drink', 'alcohol', 'pint']),
  pick('cutlery', 'food', 'fork-knife', ['meal', 'restaurant', 'dining']),
  pick('grain', 'food', 'grains', ['wheat', 'cereal', 'crop']),

  pick('tree', 'nature', 'tree', ['forest', 'wood', 'park']),
  pick('pine', 'nature', 'tree-evergreen', ['tree', 'conifer', 'forest']),
  pick('leaf', 'nature', 'leaf', ['plant', 'green']),
  pick('drop', 'nature', 'drop', ['water', 'liquid', 'rain']),
  pick('sun', 'nature', 'sun', ['weather', 'sunny', 'solar']),
  pick('cloud', 'nature', 'cloud', ['weather', 'cloudy', 'sky']),
  pick('rain', 'nature', 'cloud-rain', ['weather', 'rainfall', 'cloud']),
  pick('snowflake', 'nature', 'snowflake', ['snow', 'winter', 'cold']),
  pick('flower', 'nature', 'flower', ['plant', 'blossom', 'garden']),
  pick('sprout', 'nature', 'plant', ['plant', 'seedling', 'growth']),
  pick('fire', 'nature', 'fire', ['flame', 'wildfire', 'heat']),
  pick('globe', 'nature', 'globe-hemisphere-west', ['earth', 'world', 'planet']),

  pick('coin', 'money', 'coin', ['cash', 'currency']),
  pick('coins', 'money', 'coins', ['cash', 'savings', 'stack']),
  pick('banknote', 'money', 'money', ['cash', 'bill', 'note']),
  pick('dollar', 'money', 'currency-dollar', ['currency', 'usd']),
  pick('euro', 'money', 'currency-eur', ['currency', 'eur']),
  pick('card', 'money', 'credit-card', ['payment', 'credit', 'debit']),
  pick('wallet', 'money', 'wallet', ['payment', 'purse']),
  pick('piggy-bank', 'money', 'piggy-bank', ['savings', 'piggy']),

  pick('phone', 'devices', 'device-mobile', ['mobile', 'smartphone', 'cell']),
  pick('laptop', 'devices', 'laptop', ['computer', 'notebook']),
  pick('desktop', 'devices', 'desktop', ['computer', 'monitor', 'screen']),
  pick('tablet', 'devices', 'device-tablet', ['device', 'screen', 'touch']),
  pick('tv', 'devices', 'television', ['television', 'screen', 'broadcast']),
  pick('camera', 'devices', 'camera', ['photo', 'photography']),
  pick('headphones', 'devices', 'headphones', ['audio', 'music', 'listening']),
  pick('watch', 'devices', 'watch', ['time', 'wristwatch', 'wearable']),

  pick('bulb', 'energy', 'lightbulb', ['light', 'lamp', 'electricity']),
  pick('plug', 'energy', 'plug', ['electricity', 'power', 'socket']),
  pick('battery', 'energy', 'battery-full', ['power', 'charge', 'storage']),
  pick('solar-panel', 'energy', 'solar-panel', ['solar', 'renewable', 'electricity']),
  pick('wind-turbine', 'energy', 'windmill', ['wind', 'renewable', 'electricity']),

  pick('heart', 'health', 'heart', ['love', 'cardio', 'health']),
  pick('pill', 'health', 'pill', ['medicine', 'drug', 'capsule']),
  pick('first-aid', 'health', 'first-aid', ['medical', 'cross', 'aid']),
  pick('medkit', 'health', 'first-aid-kit', ['first-aid', 'medical', 'kit']),
  pick('syringe', 'health', 'syringe', ['vaccine', 'injection', 'needle']),
  pick('stethoscope', 'health', 'stethoscope', ['doctor', 'medical', 'checkup']),
  pick('thermometer', 'health', 'thermometer', ['temperature', 'fever']),
  pick('virus', 'health', 'virus', ['disease', 'germ', 'infection']),
  pick('ambulance', 'health', 'ambulance', ['emergency', 'medical', 'vehicle']),

  pick('graduation', 'education', 'graduation-cap', ['school', 'university', 'degree']),
  pick('book', 'education', 'book', ['reading', 'library', 'school']),

  pick('circle', 'shapes', 'circle', ['round', 'dot', 'disc']),
  pick('square', 'shapes', 'square', ['box', 'block']),
  pick('star', 'shapes', 'star', ['rating', 'favourite']),
  pick('triangle', 'shapes', 'triangle', ['delta', 'polygon']),
  pick('hexagon', 'shapes', 'hexagon', ['polygon', 'six']),
  pick('diamond', 'shapes', 'diamond', ['rhombus', 'lozenge']),
];

export interface GlyphIndexEntry {
  name: string;
  category: GlyphCategoryName;
  tags: string[];
  source: string;
  viewBox: [number, number, number, number];
  svg: string;
  inkArea: number;
  bbox: { x: number; y: number; width: number; height: number };
  boxFraction: number;
}

export interface GlyphIndexFile {
  format: typeof GLYPH_INDEX_FORMAT;
  set: { name: string; version: string; licence: string; licenceFile: string };
  glyphs: GlyphIndexEntry[];
}

export function iconPackageDir(): string {
  const require = createRequire(import.meta.url);
  // The exports map hides package.json, so resolve a file it does export.
  const probe = require.resolve(`${iconPackage}/assets/fill/circle-fill.svg`);
  return resolve(dirname(probe), '..', '..');
}

export function iconPackageVersion(): string {
  const pkg = JSON.parse(readFileSync(join(iconPackageDir(), 'package.json'), 'utf8')) as { version: string; license: string };
  if (pkg.license !== 'MIT') throw new Error(`${iconPackage} now declares licence ${pkg.license}; review before bundling`);
  return pkg.version;
}

const SVG_NS = 'http://www.w3.org/2000/svg';
/** Attributes that change painted ink, in the order they are written. */
const ROOT_KEEP = ['viewBox', 'fill', 'fill-rule'];
const PATH_KEEP = ['d', 'fill', 'fill-rule'];
/** Attributes that only matter to a web page or icon site; dropped without changing ink. */
const DROPPABLE = /^(xmlns|id|class|role|width|height|focusable|aria-.*|data-.*)$/;

/**
 * The icon reduced to a root <svg> and its <path> children, with only ink-relevant attributes.
 * Anything else (groups, other shapes, transforms, strokes, styles) fails loudly: such an icon
 * needs a look before it is bundled, rather than a silent change to its ink.
 */
export function minimalSvg(markup: string, label: string): string {
  const root = parseXml(markup);
  if (root.qname !== 'svg' || root.attrs.xmlns !== SVG_NS) throw new Error(`${label}: root is not an SVG-namespace <svg>`);
  checkAttributes(root, ROOT_KEEP, label);
  let out = `<svg xmlns="${SVG_NS}"${writeAttributes(root, ROOT_KEEP)}>`;
  for (const child of root.children) {
    if (child.qname !== 'path') throw new Error(`${label}: <${child.qname}> is not a plain <path>; handle it by hand`);
    if (child.children.length) throw new Error(`${label}: a <path> has child elements`);
    checkAttributes(child, PATH_KEEP, label);
    out += `<path${writeAttributes(child, PATH_KEEP)}/>`;
  }
  if (root.text.trim() !== '') throw new Error(`${label}: the <svg> holds text content`);
  return out + '</svg>';
}

function checkAttributes(el: XmlElement, keep: string[], label: string): void {
  for (const name of Object.keys(el.attrs)) {
    if (!keep.includes(name) && !DROPPABLE.test(name)) throw new Error(`${label}: <${el.qname}> has attribute ${name}, which may change its ink`);
  }
}

function writeAttributes(el: XmlElement, keep: string[]): string {
  let s = '';
  for (const name of keep) if (el.attrs[name] !== undefined) s += ` ${name}="${escapeAttribute(el.attrs[name])}"`;
  return s;
}

function escapeAttribute(value: string): string {
  return value.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/"/g, '&quot;');
}

export function roundTo(value: number, decimals: number): number {
  const f = 10 ** decimals;
  const r = Math.round(value * f) / f;
  return r === 0 ? 0 : r; // no -0 in the file
}

export function checkChoices(choices: GlyphChoice[]): void {
  const names = new Set<string>();
  const sources = new Set<string>();
  for (const c of choices) {
    if (!/^[a-z][a-z0-9]*(-[a-z0-9]+)*$/.test(c.name)) throw new Error(`glyph name "${c.name}" is not short lower-case words joined by hyphens`);
    if (names.has(c.name)) throw new Error(`glyph name "${c.name}" is used twice`);
    if (sources.has(c.source)) throw new Error(`upstream icon ${c.source} is bundled twice`);
    if (c.tags.length < 2 || c.tags.length > 5) throw new Error(`${c.name}: give 2 to 5 tags`);
    if (new Set(c.tags).size !== c.tags.length || c.tags.includes(c.name)) throw new Error(`${c.name}: tags repeat each other or the name`);
    for (const t of c.tags) if (!/^[a-z][a-z0-9-]*$/.test(t)) throw new Error(`${c.name}: tag "${t}" is not lower-case`);
    if (!glyphCategories.includes(c.category)) throw new Error(`${c.name}: unknown category ${c.category}`);
    names.add(c.name);
    sources.add(c.source);
  }
}

/** One glyph measured from its minimal markup. Throws when measureGlyph has any warning. */
export function indexEntry(choice: GlyphChoice, svg: string): GlyphIndexEntry {
  const ink = measureGlyph(svg);
  if (ink.warnings.length) {
    throw new Error(`${choice.name} (${choice.source}): ${ink.warnings.map((w) => `${w.code}: ${w.message}`).join('; ')}`);
  }
  const vb = ink.viewBox;
  if (!vb) throw new Error(`${choice.name}: no viewBox`);
  const u = (v: number) => roundTo(v, UNIT_DECIMALS);
  return {
    name: choice.name,
    category: choice.category,
    tags: [...choice.tags],
    source: choice.source,
    viewBox: [vb.x, vb.y, vb.width, vb.height],
    svg,
    inkArea: u(ink.areaUnits2),
    bbox: { x: u(ink.bbox.x), y: u(ink.bbox.y), width: u(ink.bbox.width), height: u(ink.bbox.height) },
    boxFraction: roundTo(ink.boxFraction, FRACTION_DECIMALS),
  };
}

export function buildGlyphIndex(choices: GlyphChoice[] = glyphChoices): GlyphIndexFile {
  checkChoices(choices);
  const fillDir = join(iconPackageDir(), 'assets', 'fill');
  const glyphs = choices
    .map((c) => indexEntry(c, minimalSvg(readFileSync(join(fillDir, c.source), 'utf8'), c.source)))
    .sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  return {
    format: GLYPH_INDEX_FORMAT,
    set: { name: 'Phosphor Icons (fill)', version: iconPackageVersion(), licence: 'MIT', licenceFile: licenceFileName },
    glyphs,
  };
}

export function glyphIndexText(index: GlyphIndexFile = buildGlyphIndex()): string {
  return JSON.stringify(index, null, 2) + '\n';
}

function readOrEmpty(path: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch {
    return ''; // missing: written below, or reported as stale with --check
  }
}

function main(): void {
  const check = process.argv.includes('--check');
  const text = glyphIndexText();
  const licence = readFileSync(join(iconPackageDir(), 'LICENSE'), 'utf8');
  const stale: string[] = [];
  if (readOrEmpty(glyphIndexPath) !== text) stale.push(glyphIndexPath);
  if (readOrEmpty(licenceCopyPath) !== licence) stale.push(licenceCopyPath);
  if (check) {
    for (const path of stale) console.error(`stale: ${path}`);
    if (stale.length) process.exit(1);
    console.log('glyph index is current');
    return;
  }
  writeFileSync(glyphIndexPath, text);
  copyFileSync(join(iconPackageDir(), 'LICENSE'), licenceCopyPath);
  const count = (JSON.parse(text) as GlyphIndexFile).glyphs.length;
  console.log(`glyph index written: ${count} glyphs (${stale.length} file(s) changed)`);
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) main();
