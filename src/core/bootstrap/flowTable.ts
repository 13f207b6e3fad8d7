import type { Instrument } from '../instruments/instrument.ts';
import { zeros } from '../interpolation/types.ts';

/**
 * The curve's values at every instrument's cash-flow times, instrument after instrument in pillar
 * order. `Instrument.quoteFromFlows` reads an instrument's model quote from it, so repricing a
 * quote needs no second pass over the curve once the table holds the curve's values.
 *
 * The instrument of node k (k = 1..n, instruments[k - 1]) has its j-th flow at index
 * offset[k] + j of `ln` and `df`.
 */
export class FlowTable {
  /** Where node k's flows start in `ln` and `df`; offset[0] is unused. */
  readonly offset: number[];
  /** ln DF at each flow time. */
  readonly ln: number[];
  /** DF at each flow time, exp(ln). */
  readonly df: number[];
  /** The largest number of flows of one instrument. */
  readonly maxFlows: number;

  constructor(instruments: readonly Instrument[]) {
    const n = instruments.length;
    // Plain arrays of doubles, not typed arrays: see `zeros`.
    this.offset = zeros(n + 1);
    let total = 0;
    let most = 0;
    for (let k = 1; k <= n; k++) {
      const count = instruments[k - 1]!.times.length;
      this.offset[k] = total;
      total += count;
      most = Math.max(most, count);
    }
    this.ln = zeros(total);
    this.df = zeros(total);
    this.maxFlows = most;
  }

  /** The number of flows of all instruments together. */
  get size(): number {
    return this.ln.length;
  }

  /** Sets every entry from a curve's ln DF. */
  fill(instruments: readonly Instrument[], lnDiscountAt: (t: number) => number): void {
    const { offset, ln, df } = this;
    for (let i = 0; i < instruments.length; i++) {
      const { times } = instruments[i]!;
      const start = offset[i + 1]!;
      for (let j = 0; j < times.length; j++) {
        const x = lnDiscountAt(times[j]!);
        ln[start + j] = x;
        df[start + j] = Math.exp(x);
      }
    }
  }

  /** Every instrument's model quote, read from the table. */
  modelQuotes(instruments: readonly Instrument[]): number[] {
    const models = new Array<number>(instruments.length);
    for (let i = 0; i < instruments.length; i++) models[i] = instruments[i]!.quoteFromFlows(this.ln, this.df, this.offset[i + 1]!);
    return models;
  }
}
