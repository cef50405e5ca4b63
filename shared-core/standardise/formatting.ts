// Numbers as unit names and footnotes print them: "100,000", never "1e5".

/** A positive number with thousands separators and at most six decimals, e.g. 100000 -> "100,000". */
export function groupedNumber(n: number): string {
  const [whole, frac] = String(Number(n.toFixed(6))).split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return frac ? `${grouped}.${frac}` : grouped;
}

/** "residents" -> "resident", "households" -> "household", "families" -> "family"; other words unchanged. */
export function singular(noun: string): string {
  if (/ies$/i.test(noun)) return noun.slice(0, -3) + 'y';
  if (/[^s]s$/i.test(noun)) return noun.slice(0, -1);
  return noun;
}
