import type { Quote } from '../document/types.ts';
import { CompiledInstrument } from './instrument.ts';

/**
 * An instrument that fixes the ratio of two discount factors on its curve: 0 at S and a growth
 * G = e^lnGrowth at E against DF(S), so DF(S) / DF(E) = G (a deposit or FRA starting after the
 * valuation date, G = 1 + r tau; a three-month future, G = (1 + R tau) over its known fixings). The
 * subclass sets `tau` and `lnGrowth` (NaN when the quote implies a growth <= 0) and says how its
 * quote is read back (`quoteFromFlows`).
 */
export abstract class GrowthRatio<Q extends Quote> extends CompiledInstrument<Q> {
  declare readonly tau: number;
  declare readonly lnGrowth: number;

  /** DF(S). */
  targetFromFlows(_ln: ArrayLike<number>, df: ArrayLike<number>, offset: number): number {
    return df[offset]!;
  }

  /** d DF(S) / d ln DF: DF(S) at S, 0 at E. */
  targetSlopes(_ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, out: number[]): void {
    out[0] = df[offset]!;
    out[1] = 0;
  }

  /** The solvers' residual in ln space: ln G + ln DF(E) - ln DF(S), the same root as G DF(E) - DF(S). */
  residualFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number): number {
    return this.lnGrowth + ln[offset + 1]! - ln[offset]!;
  }
}
