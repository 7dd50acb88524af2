/** Named tolerances of the temperature and repeatability analyses (analysis.md §9, §11). */
export const THERMAL = {
  /** |Δα| below this (1/K) is no mismatch: the body has no thermal centre (§9) */
  noMismatchPerK: 1e-12,
  /** the mismatch is fought when max|e − J t| exceeds this fraction of max|e| (§7 thermal-mismatch) */
  foughtRelative: 1e-9,
  /** entries below this fraction of the largest of their kind are round-off and reported as 0 */
  roundOff: 1e-12,
} as const;

/** Named tolerances and iteration limits of the statics solves (analysis.md §3–§4). */
export const STATICS = {
  /** a seat lifts off when its force is below −this × max|λ| */
  liftOffRelative: 1e-9,
  /** a load drives a free motion when its normalised part along the null space exceeds this */
  drivenRelative: 1e-9,
  /** a released seat is re-added when the solution pushes into it by more than this × max|u| */
  readdRelative: 1e-9,
  /** active-set passes: generous for m contacts (each may be released and re-added) */
  activeSetIterations: (m: number) => 4 * m + 10,
  /** iterative-refinement steps of one solve */
  refinementSteps: 3,
  /** Hertz fixed point: passes, and the relative force change that ends it */
  hertzIterations: 60,
  hertzConvergence: 1e-12,
  /** stiffness given to a row with none (released, or Hertz at zero force), as a fraction of the largest */
  releasedStiffnessFraction: 1e-6,
  /** seat forces below this × max|λ| are round-off and reported as 0 */
  forceRoundOff: 1e-13,
  /** foundation entries below this × (max k × 1 µm) are round-off and reported as 0 */
  foundationRoundOff: 1e-12,
  /** beyond this many foundation entries (ground contacts × contacts), the negligible ones are left out of the report */
  sparseFoundationEntries: 20000,
} as const;
