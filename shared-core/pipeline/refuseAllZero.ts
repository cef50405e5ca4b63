// A chart whose values are all zero compares nothing: every mark is drawn as nothing and no lie factor
// exists. Said in plain words before any layout, and written only when the designer asks for it.
import type { ChartSpec } from '../document/index';
import { TallyError } from '../errors';

/** Throws TallyError('data-invalid') when every value is zero and neither the document nor the caller allows it. */
export function refuseAllZero(spec: ChartSpec, allowedByCaller = false): void {
  if (spec.allowAllZero === true || allowedByCaller) return;
  if (!spec.data.every((row) => row.value === 0)) return;
  const n = spec.data.length;
  throw new TallyError(
    'data-invalid',
    `Every value is zero (${n === 1 ? 'the only row' : `all ${n} rows`}), so there is nothing to compare: the chart would show no marks and no lie factor can be measured. ` +
      'Check the data; to write such a chart anyway, set "allowAllZero": true in the document (or use --allow-all-zero on the command line).',
    { reason: 'nothing-to-compare' },
  );
}
