import type { IsoDate } from '../time/date.ts';
import type { CurveDayCount, DayCount } from '../time/dayCount.ts';
import type { Compounding } from '../rates/compounding.ts';
import type { InterpolationId } from '../interpolation/types.ts';
import type { Extrapolation } from '../curve/curve.ts';
import type { FitModel } from '../fit/parametricForm.ts';

/** Quote kinds the engine bootstraps from. */
export const QUOTE_KINDS = ['deposit', 'bill', 'zero', 'bond', 'swap'] as const;
export type QuoteKind = (typeof QUOTE_KINDS)[number];

/** Fields every validated quote carries. `maturity` is resolved from `tenor` when one was given. */
interface QuoteCommon {
  /** Position in the document's `quotes` array. */
  readonly index: number;
  readonly maturity: IsoDate;
  /** The tenor as given (upper case), or null when the quote gave a maturity date. */
  readonly tenor: string | null;
  readonly enabled: boolean;
}

/** Money-market deposit: simple rate (decimal) on its day count from settlement to maturity. */
export interface DepositQuote extends QuoteCommon {
  readonly kind: 'deposit';
  readonly rate: number;
  readonly dayCount: DayCount;
}
/** Discount bill: bank discount yield (decimal, actual/360) or price per 100. */
export interface BillQuote extends QuoteCommon {
  readonly kind: 'bill';
  readonly discountYield: number | null;
  readonly price: number | null;
}
/** Zero-coupon bond: price per 100 face, or a zero rate with its compounding and day count. */
export interface ZeroQuote extends QuoteCommon {
  readonly kind: 'zero';
  readonly price: number | null;
  readonly rate: number | null;
  readonly compounding: Compounding;
  readonly dayCount: DayCount;
}
/** Fixed-coupon bond: coupon (decimal per year) paid `frequency` times a year; clean price per 100 or ICMA yield. */
export interface BondQuote extends QuoteCommon {
  readonly kind: 'bond';
  readonly coupon: number;
  readonly frequency: number;
  readonly cleanPrice: number | null;
  readonly yield: number | null;
  readonly dayCount: DayCount;
  readonly eom: boolean;
}
/** Single-curve par swap from settlement: fixed rate (decimal) on the fixed leg's frequency and day count. */
export interface SwapQuote extends QuoteCommon {
  readonly kind: 'swap';
  readonly rate: number;
  readonly frequency: number;
  readonly dayCount: DayCount;
  readonly eom: boolean;
}
export type Quote = DepositQuote | BillQuote | ZeroQuote | BondQuote | SwapQuote;

export interface CurveSettings {
  readonly dayCount: CurveDayCount;
  readonly interpolation: InterpolationId;
  readonly extrapolation: Extrapolation;
  /** The parametric fit shown beside the exact bootstrap; 'none' for none. */
  readonly fit: 'none' | FitModel;
}

/** A validated workspace: what the engine builds from. Reserved keys are passed through untouched. */
export interface Workspace {
  readonly settlement: IsoDate;
  readonly curve: CurveSettings;
  /** Every quote that validated (enabled or not), in document order. */
  readonly quotes: readonly Quote[];
  /** Count of entries in the document's quotes array. */
  readonly quoteCount: number;
  /** Top-level keys reserved for the workbench (scenarios, strategy, snapshots, view, note), as given. */
  readonly reserved: Readonly<Record<string, unknown>>;
}

export const DEFAULT_CURVE: CurveSettings = { dayCount: 'ACT/365F', interpolation: 'monotone-convex', extrapolation: 'none', fit: 'none' };
