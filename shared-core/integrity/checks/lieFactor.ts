// A pair of categories whose drawing grows by more or less than their data: Tufte's lie factor beyond 0.95-1.05.
import type { FileCheck } from '../measureFile';
import { TUFTE_BASIS } from './lieFactorBasis';

/** Its findings are the gate's (gate.ts), which ranks every failing pair by how far it is from faithful. */
export const lieFactor: FileCheck = {
  code: 'lie-factor',
  name: 'Lie factor outside 0.95–1.05',
  severity: 'blocking',
  category: 'lie-factor',
  basis: TUFTE_BASIS,
  run: (m) => m.verdict.findings.filter((f) => f.code === 'lie-factor'),
};
