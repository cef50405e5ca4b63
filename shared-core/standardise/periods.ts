// Reading a label or a column value as a period of time (a year, a quarter, a month), so that rules can
// tell a series over time from categories, and price adjustment can find a period in an index table.

export type PeriodGranularity = 'year' | 'quarter' | 'month';

export interface Period {
  /** The text as given, trimmed: the key used to look the period up in an index table. */
  text: string;
  granularity: PeriodGranularity;
  /** Start of the period in years on one continuous axis (2021 Q3 is 2021.5), for spacing checks. */
  startYears: number;
}

const MONTHS = ['jan', 'feb', 'mar', 'apr', 'may', 'jun', 'jul', 'aug', 'sep', 'oct', 'nov', 'dec'];
/** Years outside this span are more likely counts or codes than calendar years. Common practice, no source. */
const MIN_YEAR = 1000;
const MAX_YEAR = 2999;

function year(text: string): number | null {
  const y = Number(text);
  return Number.isInteger(y) && y >= MIN_YEAR && y <= MAX_YEAR ? y : null;
}

function monthIndex(text: string): number | null {
  const i = MONTHS.indexOf(text.slice(0, 3).toLowerCase());
  if (i < 0) return null;
  // "Mar", "March", "Mar." are months; "Marmalade" is not.
  const full = ['january', 'february', 'march', 'april', 'may', 'june', 'july', 'august', 'september', 'october', 'november', 'december'][i];
  const t = text.toLowerCase().replace(/\.$/, '');
  return t === MONTHS[i] || t === full || (i === 8 && t === 'sept') ? i : null;
}

/**
 * The period a label names, or null when it is not one. Understood: "2019", "FY2019", "2019/20" and
 * "2019-20" (a year starting in 2019), "2021 Q3", "Q3 2021", "2021-Q3", "2021-03", "Mar 2021", "March 2021".
 */
export function parsePeriod(label: string): Period | null {
  const text = label.trim();
  let m = /^(?:FY\s*)?(\d{4})(?:\s*[/-]\s*(\d{2}|\d{4}))?$/i.exec(text);
  if (m) {
    const y = year(m[1]);
    if (y === null) return null;
    if (m[2] !== undefined) {
      // "2019-20" is a split year only when the second part is the next year; "2019-03" is a month.
      const next = m[2].length === 2 ? (y + 1) % 100 : y + 1;
      if (Number(m[2]) !== next) {
        const month = Number(m[2]);
        if (m[2].length === 2 && month >= 1 && month <= 12 && text.includes('-')) return { text, granularity: 'month', startYears: y + (month - 1) / 12 };
        return null;
      }
    }
    return { text, granularity: 'year', startYears: y };
  }
  m = /^(\d{4})\s*[-\s]?\s*Q([1-4])$/i.exec(text) ?? null;
  if (m) {
    const y = year(m[1]);
    return y === null ? null : { text, granularity: 'quarter', startYears: y + (Number(m[2]) - 1) / 4 };
  }
  m = /^Q([1-4])\s*[-\s]?\s*(\d{4})$/i.exec(text);
  if (m) {
    const y = year(m[2]);
    return y === null ? null : { text, granularity: 'quarter', startYears: y + (Number(m[1]) - 1) / 4 };
  }
  m = /^([A-Za-z]{3,9}\.?)\s+(\d{4})$/.exec(text);
  if (m) {
    const mi = monthIndex(m[1]);
    const y = year(m[2]);
    return mi === null || y === null ? null : { text, granularity: 'month', startYears: y + mi / 12 };
  }
  return null;
}

/** Length of one step of a granularity, in years. */
export const STEP_YEARS: Readonly<Record<PeriodGranularity, number>> = Object.freeze({ year: 1, quarter: 0.25, month: 1 / 12 });

/**
 * The periods of a series when every label is a period of one granularity (at least two of them), else null:
 * a mixture such as "2019" and "Q3 2020" is not read as one time axis.
 */
export function periodSeries(labels: readonly string[]): Period[] | null {
  if (labels.length < 2) return null;
  const periods = labels.map(parsePeriod);
  if (periods.some((p) => p === null)) return null;
  const all = periods as Period[];
  return all.every((p) => p.granularity === all[0].granularity) ? all : null;
}
