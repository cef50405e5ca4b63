// A category whose value is 0 drawn with ink; a zero must show nothing.
import type { FileCheck } from '../measureFile';
import { TUFTE_BASIS } from './lieFactorBasis';

/** Its findings are the gate's (gate.ts), which ranks every failing pair by how far it is from faithful. */
export const zeroDrawn: FileCheck = {
  code: 'zero-drawn',
  name: 'Zero drawn with ink',
  severity: 'blocking',
  category: 'lie-factor',
  basis: TUFTE_BASIS,
  run: (m) => m.verdict.findings.filter((f) => f.code === 'zero-drawn'),
};
