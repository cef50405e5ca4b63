// Graphic per unit of value differs between categories by more than the band allows (max / min of g/d), even when each pair passes.
import type { FileCheck } from '../measureFile';
import { TUFTE_BASIS } from './lieFactorBasis';

/** Its findings are the gate's (gate.ts), which ranks every failing pair by how far it is from faithful. */
export const spread: FileCheck = {
  code: 'spread',
  name: 'More than one scale',
  severity: 'blocking',
  category: 'lie-factor',
  basis: TUFTE_BASIS,
  run: (m) => m.verdict.findings.filter((f) => f.code === 'spread'),
};
