// Adjustments check every row before failing, so the designer sees all the rows to fix at once.
import { TallyError } from '../errors';
import type { AdjustmentProblem } from './types';

/** Throws one TallyError('data-invalid') that states the first problem, counts the rest and lists all in details. */
export function throwIfProblems(what: string, problems: readonly AdjustmentProblem[]): void {
  if (problems.length === 0) return;
  const first = problems[0];
  const more = problems.length > 1 ? ` (and ${problems.length - 1} more problem${problems.length > 2 ? 's' : ''})` : '';
  const where = first.label !== undefined ? `"${first.label}": ` : '';
  throw new TallyError('data-invalid', `${what}: ${where}${first.message}${more}`, { problems: [...problems] });
}

/** A finite number from a table cell, or null: numbers written as text ("12,400") are read too. */
export function numberFromCell(cell: unknown): number | null {
  if (typeof cell === 'number') return Number.isFinite(cell) ? cell : null;
  if (typeof cell === 'string' && /^\s*[-+]?[\d,]*\.?\d+(?:e[-+]?\d+)?\s*$/i.test(cell)) {
    const n = Number(cell.replace(/,/g, ''));
    return Number.isFinite(n) ? n : null;
  }
  return null;
}
