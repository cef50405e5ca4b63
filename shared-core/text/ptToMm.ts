// Points and millimetres are CSS absolute units (CSS Values and Units Level 3, section 5.2):
// 1in = 25.4mm = 72pt, so 1pt = 25.4 / 72 mm.

const MM_PER_INCH = 25.4;
const PT_PER_INCH = 72;

export function ptToMm(pt: number): number {
  return (pt * MM_PER_INCH) / PT_PER_INCH;
}

export function mmToPt(mm: number): number {
  return (mm * PT_PER_INCH) / MM_PER_INCH;
}
