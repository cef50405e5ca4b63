// Whether a unit name speaks of money, and in which currency: the money rules and the price adjustment
// need to know, and a designer rarely says so in a separate field.

export interface MoneyUnit {
  /** A currency we recognise (ISO 4217 code where the name is unambiguous, e.g. "EUR"; "$" for a bare dollar sign), or null for money of unstated currency. */
  currency: string | null;
}

// Symbols and words that name one currency. A bare "$" or "dollars" is kept as "$": several countries use it.
const WORDS: readonly [RegExp, string][] = [
  [/€|\beuros?\b|\bEUR\b/i, 'EUR'],
  [/£|\bpounds? sterling\b|\bGBP\b/i, 'GBP'],
  [/¥|\byen\b|\bJPY\b/i, 'JPY'],
  [/\bUS\$|\bUSD\b|\bUS dollars?\b/i, 'USD'],
  [/\bCA\$|\bCAD\b|\bCanadian dollars?\b/i, 'CAD'],
  [/\bA\$|\bAUD\b|\bAustralian dollars?\b/i, 'AUD'],
  [/\bCHF\b|\bSwiss francs?\b/i, 'CHF'],
  [/₹|\bINR\b|\brupees?\b/i, 'INR'],
  [/\bSEK\b|\bNOK\b|\bDKK\b|\bkron(?:a|or|e|er)\b/i, 'kronor'],
  [/\$|\bdollars?\b/i, '$'],
];

// ISO 4217 codes for other currencies, checked as whole upper-case words (from memory; the list is not exhaustive).
const OTHER_CODES = new Set(['NZD', 'CNY', 'HKD', 'SGD', 'KRW', 'BRL', 'MXN', 'ZAR', 'PLN', 'CZK', 'HUF', 'TRY', 'RUB', 'ILS', 'THB', 'IDR', 'PHP', 'MYR', 'ARS', 'CLP', 'COP', 'EGP', 'NGN', 'KES']);

// Words that make a unit money even without a currency. Common practice, no source.
const MONEY_WORDS = /\b(money|cost|costs|price|prices|spend|spending|revenue|income|salary|salaries|wage|wages|budget|turnover|earnings|pay|rent|fees?)\b/i;

/** The money a unit name speaks of, or null when it does not look like money. */
export function moneyUnitOf(unitName: string | undefined): MoneyUnit | null {
  if (!unitName) return null;
  for (const [pattern, code] of WORDS) if (pattern.test(unitName)) return { currency: code };
  for (const word of unitName.split(/[^A-Za-z]+/)) if (OTHER_CODES.has(word)) return { currency: word };
  return MONEY_WORDS.test(unitName) ? { currency: null } : null;
}

/** The currency written in a row's currency cell, normalised the same way ("euros" and "EUR" agree). */
export function currencyOfText(text: string): string {
  return moneyUnitOf(text)?.currency ?? text.trim().toUpperCase();
}
