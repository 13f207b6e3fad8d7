/**
 * Nelson-Siegel and Svensson forms of the continuously compounded zero rate (decimal per year)
 * at t years on the curve's axis:
 *   y(t) = b0 + b1 L1(t/tau1) + b2 [L1(t/tau1) - e^(-t/tau1)]  (+ b3 [L1(t/tau2) - e^(-t/tau2)]),
 *   L1(x) = (1 - e^(-x)) / x,  L1(0) = 1;   DF(t) = e^(-y(t) t).
 * Instantaneous forward f(t) = b0 + b1 e^(-x1) + b2 x1 e^(-x1) (+ b3 x2 e^(-x2)), x = t/tau.
 * Sources: C. R. Nelson and A. F. Siegel, "Parsimonious Modeling of Yield Curves", Journal of
 * Business 60(4), 1987; L. E. O. Svensson, "Estimating and Interpreting Forward Interest Rates:
 * Sweden 1992-1994", NBER Working Paper 4871 / IMF WP/94/114, 1994. Betas are decimals, taus years.
 */
export const FIT_MODELS = ['nelson-siegel', 'svensson'] as const;
export type FitModel = (typeof FIT_MODELS)[number];
export const isFitModel = (x: unknown): x is FitModel => x === 'nelson-siegel' || x === 'svensson';
export const FIT_MODEL_LABEL: Readonly<Record<FitModel, string>> = { 'nelson-siegel': 'Nelson-Siegel', svensson: 'Svensson' };

export interface ParametricParams {
  readonly model: FitModel;
  readonly b0: number;
  readonly b1: number;
  readonly b2: number;
  /** Second hump (Svensson); 0 for Nelson-Siegel. */
  readonly b3: number;
  readonly tau1: number;
  /** Svensson's second decay, years; null for Nelson-Siegel. */
  readonly tau2: number | null;
}

/** Bounds of the fit: taus in years, 0.05 <= tau <= 30; Svensson keeps tau2 >= TAU_RATIO_MIN x tau1. */
export const TAU_MIN = 0.05;
export const TAU_MAX = 30;
export const TAU_RATIO_MIN = 1.5;
/** Betas are kept within +-BETA_BOUND (decimal; 1 = 100%); b0 may be negative. */
export const BETA_BOUND = 1;

/** L1(x) = (1 - e^-x)/x with L1(0) = 1, by expm1 for accuracy at small x. */
export const slopeLoading = (x: number): number => (x === 0 ? 1 : -Math.expm1(-x) / x);
/** L2(x) = L1(x) - e^-x. */
export const curvatureLoading = (x: number): number => (x === 0 ? 0 : -Math.expm1(-x) / x - Math.exp(-x));

export function parametricZero(p: ParametricParams, t: number): number {
  const x1 = t / p.tau1;
  let y = p.b0 + p.b1 * slopeLoading(x1) + p.b2 * curvatureLoading(x1);
  if (p.tau2 !== null) y += p.b3 * curvatureLoading(t / p.tau2);
  return y;
}

export function parametricForward(p: ParametricParams, t: number): number {
  const x1 = t / p.tau1;
  const e1 = Math.exp(-x1);
  let f = p.b0 + p.b1 * e1 + p.b2 * x1 * e1;
  if (p.tau2 !== null) {
    const x2 = t / p.tau2;
    f += p.b3 * x2 * Math.exp(-x2);
  }
  return f;
}

export const parametricLnDiscount = (p: ParametricParams, t: number): number => (t <= 0 ? 0 : -parametricZero(p, t) * t);

/** Parameter vector order: NS [b0, b1, b2, tau1]; Svensson [b0, b1, b2, b3, tau1, tau2]. */
export function paramsFromVector(model: FitModel, v: ArrayLike<number>): ParametricParams {
  return model === 'nelson-siegel'
    ? { model, b0: v[0]!, b1: v[1]!, b2: v[2]!, b3: 0, tau1: v[3]!, tau2: null }
    : { model, b0: v[0]!, b1: v[1]!, b2: v[2]!, b3: v[3]!, tau1: v[4]!, tau2: v[5]! };
}
export const parameterCount = (model: FitModel): number => (model === 'nelson-siegel' ? 4 : 6);
export const betaCount = (model: FitModel): number => (model === 'nelson-siegel' ? 3 : 4);

/** Projects a parameter vector onto the bounds (in place). */
export function projectParams(model: FitModel, v: Float64Array, ratio = TAU_RATIO_MIN): void {
  const nb = betaCount(model);
  for (let i = 0; i < nb; i++) v[i] = Math.min(BETA_BOUND, Math.max(-BETA_BOUND, v[i]!));
  const clampTau = (x: number): number => Math.min(TAU_MAX, Math.max(TAU_MIN, Number.isFinite(x) ? x : TAU_MIN));
  v[nb] = clampTau(v[nb]!);
  if (model === 'svensson') {
    let t1 = v[4]!;
    let t2 = clampTau(v[5]!);
    if (t2 < ratio * t1) {
      // The nearest point of the line tau2 = ratio x tau1 (Euclidean projection), inside the box.
      const s = (t1 + ratio * t2) / (1 + ratio * ratio);
      t1 = s;
      t2 = ratio * s;
      if (t1 < TAU_MIN) {
        t1 = TAU_MIN;
        t2 = ratio * TAU_MIN;
      }
      if (t2 > TAU_MAX) {
        t2 = TAU_MAX;
        t1 = TAU_MAX / ratio;
      }
    }
    v[4] = t1;
    v[5] = t2;
  }
}
