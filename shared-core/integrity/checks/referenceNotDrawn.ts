// The smallest category, against which every lie factor is taken, drawn with no ink: nothing can be compared with it.
import type { FileCheck } from '../measureFile';
import { TUFTE_BASIS } from './lieFactorBasis';

/** Its findings are the gate's (gate.ts), which ranks every failing pair by how far it is from faithful. */
export const referenceNotDrawn: FileCheck = {
  code: 'reference-not-drawn',
  name: 'Reference category not drawn',
  severity: 'blocking',
  category: 'lie-factor',
  basis: TUFTE_BASIS,
  run: (m) => m.verdict.findings.filter((f) => f.code === 'reference-not-drawn'),
};
