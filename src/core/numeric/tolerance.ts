/** Named numerical tolerances and limits of the engine, in the units stated beside each. */

/** Bootstrap: a node (discount factor) is solved when one step moves it by at most this, relative. */
export const NODE_TOLERANCE = 1e-15;
/** Acceptance: |model - market| per 100 face for a price quote. */
export const PRICE_ACCEPTANCE = 1e-11;
/** Acceptance: |model - market| as a decimal rate for a rate quote. */
export const RATE_ACCEPTANCE = 1e-14;
/** Global interpolators: at most this many Gauss-Seidel sweeps over the pillars. */
export const MAX_SWEEPS = 100;
/** One-dimensional solver: at most this many function evaluations per pillar. */
export const MAX_SOLVER_EVALUATIONS = 200;
/**
 * Gaussian elimination (numeric/luDecomposition.ts): a matrix is singular when a pivot is at most
 * this times its largest |entry| (1e-14, about 45 ulps of 1).
 */
export const SINGULAR_PIVOT = 1e-14;
