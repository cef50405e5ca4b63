// Counts the drawing commands in SVG path data without building them, so a path of a million
// commands is refused before any parser allocates a million segments.

const TOKEN = /[MmLlHhVvCcSsQqTtAaZz]|[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/g;

/** Numbers each command takes (SVG 1.1 §8.3); a run of extra numbers repeats the command. */
const ARITY: Record<string, number> = { m: 2, l: 2, h: 1, v: 1, c: 6, s: 4, q: 4, t: 2, a: 7, z: 0 };

/**
 * Number of segments the path data describes, implicit repeats included. Arc flags written without
 * separators ("0 01") read as one number here, so arcs can be slightly under-counted: fine for a limit.
 */
export function countPathCommands(d: string): number {
  let count = 0;
  let arity = 0;
  let pending = 0;
  TOKEN.lastIndex = 0;
  for (let m = TOKEN.exec(d); m; m = TOKEN.exec(d)) {
    const t = m[0];
    const c = t.charCodeAt(0);
    const isLetter = (c >= 65 && c <= 90) || (c >= 97 && c <= 122);
    if (isLetter && t.length === 1 && t !== 'e' && t !== 'E') {
      const a = ARITY[t.toLowerCase()];
      count += 1;
      arity = a;
      pending = 0;
      continue;
    }
    if (arity === 0) continue;
    pending += 1;
    if (pending > arity) {
      // An implicit repeat of the current command.
      count += 1;
      pending = 1;
    }
  }
  return count;
}

/** Points of a polygon/polyline `points` list, each one a command once drawn. */
export function countPoints(points: string): number {
  let n = 0;
  TOKEN.lastIndex = 0;
  for (let m = TOKEN.exec(points); m; m = TOKEN.exec(points)) n += 1;
  return Math.ceil(n / 2);
}
