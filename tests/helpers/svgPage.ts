// Small hand-written SVG pages for the raster and measurement tests.

export const SVG_NS = 'xmlns="http://www.w3.org/2000/svg"';

/** An <svg> root with the given attributes (size, viewBox) around `body`. */
export const svgPage = (attrs: string, body = '') => `<svg ${SVG_NS} ${attrs}>${body}</svg>`;

/** A 100 x 50 mm page whose user units are millimetres. */
export const mmPage = (body: string) => svgPage('width="100mm" height="50mm" viewBox="0 0 100 50"', body);
