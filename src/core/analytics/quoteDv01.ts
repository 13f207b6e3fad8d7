import { bootstrapInstruments, type BootstrapSettings } from '../bootstrap/bootstrap.ts';
import type { Instrument } from '../instruments/instrument.ts';
import { ok, type Result } from '../result.ts';
import type { Flow } from './keyRates.ts';
import { quoteYieldOf, requoteAtYield, type QuoteYield } from './quoteYield.ts';
import { ONE_BP } from './forwardSensitivity.ts';

export interface QuoteDv01 {
  /** Index of the quote in the workspace document. */
  readonly index: number;
  readonly kind: Instrument['kind'];
  readonly maturity: string;
  /** The yield the quote is moved through. */
  readonly yieldLabel: string;
  /** -(P(q + 1bp) - P(q - 1bp)) / 2: price per 100 face per bp of the quote's own yield. */
  readonly dv01: number;
}

/** What one quote's DV01 records for its explanation: the quote's own yield, and each side's moved quote, ln DF at each flow and price. */
export interface QuoteDv01Record {
  yield: number;
  readonly sides: { readonly dy: number; readonly market: number; readonly ln: number[]; readonly price: number }[];
}

/**
 * DV01 of a set of flows to each input quote: each quote moved by +-1 bp through its own yield
 * (quoteYield.ts), the curve rebuilt with the same settings, the dirty price recomputed; central
 * difference, per 100 face per bp. Positive when a rise in the quote lowers the price.
 */
export function quoteDv01s(settings: BootstrapSettings, instruments: readonly Instrument[], flows: readonly Flow[]): Result<QuoteDv01[]> {
  const out: QuoteDv01[] = [];
  for (let k = 0; k < instruments.length; k++) {
    const ins = instruments[k]!;
    const qy = quoteYieldOf(ins, settings.settlement);
    const d = quoteDv01Of(settings, instruments, flows, k, qy);
    if (!d.ok) return d;
    out.push({ index: ins.index, kind: ins.kind, maturity: ins.maturity, yieldLabel: qy.label, dv01: d.value });
  }
  return ok(out);
}

/** One quote's DV01 (position k of `instruments`, moved through its own yield `qy`), as quoteDv01s computes it; `rec` records its steps. */
export function quoteDv01Of(settings: BootstrapSettings, instruments: readonly Instrument[], flows: readonly Flow[], k: number, qy: QuoteYield = quoteYieldOf(instruments[k]!, settings.settlement), rec?: QuoteDv01Record): Result<number> {
  const y0 = qy.toYield(instruments[k]!.market);
  if (rec) rec.yield = y0;
  const price = (dy: number): Result<number> => {
    const moved = instruments.map((ins, i) => (i === k ? requoteAtYield(ins, qy, y0 + dy) : ins));
    const built = bootstrapInstruments(settings, moved);
    if (!built.curve) return { ok: false, errors: built.errors };
    let p = 0;
    const ln: number[] = [];
    for (const f of flows) {
      const l = built.curve.lnDiscountAt(f.t);
      if (rec) ln.push(l);
      p += f.amount * Math.exp(l);
    }
    if (rec) rec.sides.push({ dy, market: moved[k]!.market, ln, price: p });
    return ok(p);
  };
  const up = price(ONE_BP);
  if (!up.ok) return up;
  const down = price(-ONE_BP);
  if (!down.ok) return down;
  return ok((down.value - up.value) / 2 + 0);
}
