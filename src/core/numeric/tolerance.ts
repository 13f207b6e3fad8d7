/**
 * Named numerical tolerances and limits of the engine, in the units stated beside each. Every
 * tolerance and iteration limit of the bootstrap and its solvers lives here.
 */

/**
 * Bootstrap: a node (ln DF) is solved when one step moves it by at most this (1e-15: about 4.5
 * ulps of 1; in DF terms a relative change of 1e-15).
 */
export const NODE_TOLERANCE = 1e-15;
/** Acceptance: |model - market| per 100 face for a price quote (1e-11: a hundred-billionth of a point). */
export const PRICE_ACCEPTANCE = 1e-11;
/** Acceptance: |model - market| as a decimal rate for a rate quote (1e-14: 1e-10 bp). */
export const RATE_ACCEPTANCE = 1e-14;
/** Global interpolators: at most this many Gauss-Seidel sweeps over the pillars. */
export const MAX_SWEEPS = 100;
/**
 * Global interpolators: a sweep whose largest node change is within NODE_TOLERANCE plus this many
 * ulps of the largest |ln DF| (8 x 2^-52 relative) has moved the nodes by rounding noise only:
 * each node solve stops within NODE_TOLERANCE of its root, so successive sweeps cannot do better.
 */
export const SWEEP_ROUNDING_ULPS = 8;
/**
 * A node is kept at its current value in a sweep when |residual| is at most this times the present
 * value of the flow at the node itself (0.25 x 1e-15): a Newton step with a quarter of that
 * sensitivity as the slope (a lower bound on dPV/dy_k in normal markets) would then move the node
 * by at most NODE_TOLERANCE.
 */
export const NODE_SETTLED_RESIDUAL = 0.25 * NODE_TOLERANCE;
/** One-dimensional solver: at most this many function evaluations per pillar. */
export const MAX_SOLVER_EVALUATIONS = 200;
/** One-dimensional solver: the first secant point is x0 plus this (1e-7 in ln DF). */
export const SOLVER_FIRST_STEP = 1e-7;
/**
 * One-dimensional solver: no root is sought beyond |ln DF| = 700 (DF below e^-700, about 1e-304,
 * or above e^700, near the largest double 1.8e308, cannot be told from 0 or infinity).
 */
export const LN_DISCOUNT_LIMIT = 700;
/** Joint Newton fallback: forward-difference bump of each node (1e-7 in ln DF, near sqrt(2^-52)). */
export const JOINT_NEWTON_BUMP = 1e-7;
/** Joint Newton fallback: at most this many Newton steps. */
export const JOINT_NEWTON_ITERATIONS = 60;
/** Joint Newton fallback: at most this many halvings of one step (a step of 2^-39 of the full one). */
export const JOINT_NEWTON_HALVINGS = 40;
/**
 * Gaussian elimination (numeric/luDecomposition.ts): a matrix is singular when a pivot is at most
 * this times its largest |entry| (1e-14, about 45 ulps of 1).
 */
export const SINGULAR_PIVOT = 1e-14;

/**
 * The bootstrap's starting forward (decimal per year, continuous on the curve's day count) for a
 * node whose previous segment has no length: a level near typical rates, so the solver's first
 * step starts close; any value in the solver's range converges to the same node.
 */
export const FLAT_GUESS_FORWARD = 0.03;

/**
 * The spot bridge (bootstrap/spotBridge.ts): at most this many bootstraps while its node
 * a = ln DF(spot) is made equal to (t_spot / t_first) ln DF(first pillar) (a secant on a scalar
 * that is affine, or nearly, in a; it settles in two or three).
 */
export const SPOT_BRIDGE_MAX_STEPS = 12;
/** The spot bridge stops when its relation holds to this many units in the last place of its node's value... */
export const SPOT_BRIDGE_ROUNDING_ULPS = 4;
/**
 * ...or to this in ln DF (1e-16: a tenth of NODE_TOLERANCE, within which the node solvers
 * leave the first pillar's node, so closer is rounding noise a secant only wanders in).
 */
export const SPOT_BRIDGE_TOLERANCE = 1e-16;

/**
 * A turn solved from a quote (bootstrap/turnSolve.ts): at most this many rounds over the solved
 * turns, each solved in turn with the others held, until every spanning quote reprices within its
 * acceptance bound (each turn's spread is solved by solveNode, with its own limits above).
 */
export const TURN_SOLVE_ROUNDS = 20;
