// A category with a positive value drawn with no ink, while the smallest category is drawn.
import type { FileCheck } from '../measureFile';
import { TUFTE_BASIS } from './lieFactorBasis';

/** Its findings are the gate's (gate.ts), which ranks every failing pair by how far it is from faithful. */
export const notDrawn: FileCheck = {
  code: 'not-drawn',
  name: 'Category not drawn',
  severity: 'blocking',
  category: 'lie-factor',
  basis: TUFTE_BASIS,
  run: (m) => m.verdict.findings.filter((f) => f.code === 'not-drawn'),
};
