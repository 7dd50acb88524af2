/** Named tolerances of the temperature and repeatability analyses (analysis.md §9, §11). */
export const THERMAL = {
  /** |Δα| below this (1/K) is no mismatch: the body has no thermal centre (§9) */
  noMismatchPerK: 1e-12,
  /** the mismatch is fought when max|e − J t| exceeds this fraction of max|e| (§7 thermal-mismatch) */
  foughtRelative: 1e-9,
  /** entries below this fraction of the largest of their kind are round-off and reported as 0 */
  roundOff: 1e-12,
} as const;
