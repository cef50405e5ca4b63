// Where the lie-factor checks come from, named on each of their findings.

/**
 * Tufte (The Visual Display of Quantitative Information, 1983, ch. 2, p. 57): lie factor = size of effect shown in
 * the graphic / size of effect in the data; beyond 0.95-1.05 the distortion is substantial.
 */
export const TUFTE_BASIS = 'Tufte, The Visual Display of Quantitative Information (1983), p. 57';
