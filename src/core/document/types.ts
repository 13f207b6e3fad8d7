import type { WorkspaceCurve } from './namedCurves.ts';
import type { ConvexityFill, ConvexityModel } from '../instruments/convexity.ts';
import type { IsoDate } from '../time/date.ts';
import type { BusinessDayRule, CalendarContext } from '../time/calendars.ts';
import type { CurveDayCount, DayCount } from '../time/dayCount.ts';
import type { Compounding } from '../rates/compounding.ts';
import type { InterpolationId } from '../interpolation/types.ts';
import type { Extrapolation } from '../curve/curve.ts';
import type { FitModel } from '../fit/parametricForm.ts';

/** Quote kinds the engine bootstraps from. */
export const QUOTE_KINDS = ['deposit', 'bill', 'zero', 'bond', 'swap', 'ois', 'par-yield', 'future', 'fra'] as const;
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

/**
 * Money-market deposit: simple rate (decimal) on its day count from `start` to maturity. Its tenor
 * may also be `ON`, `TN` or `SN` (time/depositDates.ts). `calendar` null: a deposit with an
 * ordinary tenor or date and none of the fields `calendar`, `spotLag`, `businessDay`; it runs from
 * settlement (`start`) to the maturity, unadjusted, as every deposit did before. Otherwise
 * `calendar` (default `weekends`), `spotLag` business days (default 0), `businessDay` for an
 * ordinary tenor's end (default modified-following; null for ON, TN, SN, which count business
 * days), and the `start` date they give; `maturity` is the end.
 */
export interface DepositQuote extends QuoteCommon {
  readonly kind: 'deposit';
  readonly rate: number;
  readonly dayCount: DayCount;
  readonly start: IsoDate;
  readonly calendar: string | null;
  readonly spotLag: number | null;
  readonly businessDay: BusinessDayRule | null;
  /** The workspace's own calendars and edits its dates were made on (absent: the built-ins as published). */
  readonly calendars?: CalendarContext;
  /** For a tenor on a calendar: the end before the business-day rule (the quote check shows both). */
  readonly unadjustedEnd?: IsoDate;
  /** The end-of-month rule for a month or year tenor on a calendar, present only when the quote gives `eom` (absent: off). */
  readonly eom?: boolean;
}
/**
 * A trade settled at spot (a bond's or bill's own `calendar` and `spotLag`): the price is paid on
 * `settle`, the valuation date plus `spotLag` business days on `calendar`. Absent on a quote that
 * settles on the valuation date (neither field given), which reads and prices exactly as before.
 */
export interface SpotSettled {
  readonly settle?: IsoDate;
  readonly calendar?: string;
  readonly spotLag?: number;
}
/** Discount bill: bank discount yield (decimal, actual/360, days from its settlement) or price per 100. */
export interface BillQuote extends QuoteCommon, SpotSettled {
  readonly kind: 'bill';
  readonly discountYield: number | null;
  readonly price: number | null;
}
/** Zero-coupon bond: price per 100 face, or a zero rate with its compounding and day count. */
export interface ZeroQuote extends QuoteCommon, SpotSettled {
  readonly kind: 'zero';
  readonly price: number | null;
  readonly rate: number | null;
  readonly compounding: Compounding;
  readonly dayCount: DayCount;
}
/** Fixed-coupon bond: coupon (decimal per year) paid `frequency` times a year; clean price per 100 or ICMA yield. */
export interface BondQuote extends QuoteCommon, SpotSettled {
  readonly kind: 'bond';
  readonly coupon: number;
  readonly frequency: number;
  readonly cleanPrice: number | null;
  readonly yield: number | null;
  readonly dayCount: DayCount;
  readonly eom: boolean;
}
/** Single-curve par swap from settlement: fixed rate (decimal) on the fixed leg's frequency and day count. */
export interface SwapQuote extends QuoteCommon, Partial<DatedSwapTerms> {
  readonly kind: 'swap';
  readonly rate: number;
  readonly frequency: number;
  readonly dayCount: DayCount;
  readonly eom: boolean;
}
/**
 * A swap's date conventions on a calendar (every OIS; a `swap` that gives any of `calendar`,
 * `spotLag`, `businessDay`, `paymentLag`): start at spot, accrual dates moved by the rule, payments
 * lagged. On one curve both float legs telescope, so both price with instruments/ois.ts.
 */
export interface DatedSwapTerms {
  /** A calendar id of time/calendars.ts (built-ins joined with `+`). */
  readonly calendar: string;
  /** Business days from settlement to the start. */
  readonly spotLag: number;
  readonly businessDay: BusinessDayRule;
  /** Business days from each accrual end to its payment. */
  readonly paymentLag: number;
  /** The end before the business-day rule (the maturity given, or the start plus the tenor). */
  readonly unadjustedEnd: IsoDate;
  /** The workspace's own calendars and edits its dates are made on (absent: the built-ins as published). */
  readonly calendars?: CalendarContext;
}
/** A swap priced on its dates: an OIS, or a swap quote with its date conventions. */
export type DatedSwapQuote = OisQuote | (SwapQuote & DatedSwapTerms);
/**
 * Overnight-index swap on one curve (kinds/ois.ts): fixed rate (decimal) against the compounded
 * overnight rate, with its date conventions. Defaults: frequency 1, dayCount and floatDayCount
 * ACT/360, calendar `weekends`, spotLag 0, businessDay modified-following, eom false, paymentLag 0.
 * `maturity` is the swap's adjusted end (last accrual end), `unadjustedEnd` the end before the
 * business-day rule (the maturity given, or the start plus the tenor).
 */
export interface OisQuote extends QuoteCommon {
  readonly kind: 'ois';
  readonly rate: number;
  readonly frequency: number;
  readonly dayCount: DayCount;
  /** The overnight rate's day basis (ACT/360 or ACT/365F): the compounding's D. */
  readonly floatDayCount: DayCount;
  /** A calendar id of time/calendars.ts (built-ins joined with `+`). */
  readonly calendar: string;
  /** Business days from settlement to the start. */
  readonly spotLag: number;
  readonly businessDay: BusinessDayRule;
  readonly eom: boolean;
  /** Business days from each accrual end to its payment. */
  readonly paymentLag: number;
  readonly unadjustedEnd: IsoDate;
  /** The workspace's own calendars and edits its dates are made on (absent: the built-ins as published). */
  readonly calendars?: CalendarContext;
}
/**
 * A government par yield (kinds/parYield.ts, instruments/parYield.ts): `yield` (decimal) of a
 * theoretical security maturing on `maturity`, compounded `frequency` times a year (default 2) on
 * `dayCount` (default ACT/ACT-ICMA). Above one year (more than `frequency` coupon periods) a par
 * bond: coupon = yield, clean price 100, coupons every 12/frequency months back from maturity,
 * unadjusted. At one year or less a zero-coupon bond-equivalent yield: DF = (1 + y/f)^-n over n
 * coupon periods. `eom` is not a document field: true when the maturity is a month end, as for a bond.
 */
export interface ParYieldQuote extends QuoteCommon {
  readonly kind: 'par-yield';
  readonly yield: number;
  readonly frequency: number;
  readonly dayCount: DayCount;
  readonly eom: boolean;
  /** True at one year or less on the US Treasury basis: the yield is a bill's bond-equivalent yield (its tag says so). */
  readonly billBasis: boolean;
}
/**
 * A future on an overnight rate (kinds/future.ts, instruments/future.ts): `price` = 100 minus the
 * futures rate in percent. `contract` `3M` (default): the rate compounded daily over the reference
 * quarter, from the third Wednesday of `month` to the third Wednesday three months later, simple on
 * ACT/360; `1M`: the arithmetic average of the daily rate over every calendar day of `month`.
 * `month` (`YYYY-MM`) or the period's `start` and `end` (end exclusive) as typed; `month` is null
 * when dates were given. `convexity` (bp, default 0) is the futures rate minus the forward rate:
 * the bootstrap meets the forward rate (100 - price) / 100 - convexity / 1e4. `calendar` (default
 * `us-gov-securities`) gives the business days whose rates the 1M average reads. `maturity` is the
 * curve node: the period's end for 3M; for 1M the business day on or after the month's end (the
 * last day's rate runs to it).
 */
export interface FutureQuote extends QuoteCommon {
  readonly kind: 'future';
  readonly contract: '3M' | '1M';
  readonly month: string | null;
  readonly start: IsoDate;
  /** The reference period's end (exclusive): the last IMM date for 3M, the next month's first day for 1M. */
  readonly end: IsoDate;
  readonly price: number;
  /** The adjustment in bp: as typed, else the curve's convexity model's (see `convexityFill`), else 0. */
  readonly convexity: number;
  /** When the curve's model filled `convexity`: the model, its inputs and the times it read. */
  readonly convexityFill?: ConvexityFill;
  readonly calendar: string;
  /**
   * The overnight fixings (decimal) of a contract already in its period at the valuation date, by
   * business day: every business day from the period's first fixing to the day before the
   * valuation date (absent for a contract not yet fixing).
   */
  readonly fixings?: Readonly<Record<IsoDate, number>>;
  readonly calendars?: CalendarContext;
}
/**
 * A forward rate agreement on a term index (kinds/fra.ts, instruments/fra.ts): `rate` (decimal)
 * simple on `dayCount` (the index's, default ACT/360) over the period `period` "AxB" months from
 * spot, on the index of tenor `index` (B - A months). Dates (MARKET-CONVENTIONS.md f, QuantLib's
 * FraRateHelper after its PR#1600): spot = valuation + `spotLag` business days on `calendar`;
 * start = spot + A months, end = start + the index tenor, each moved by `businessDay` with the
 * end-of-month rule `eom`; the index fixes two business days before the start (`fixing`).
 * Defaults: calendar `weekends`, spotLag 0, businessDay modified-following, eom false.
 * `maturity` is the end (the curve node). It takes no tenor or maturity (`ownDates`).
 */
export interface FraQuote extends QuoteCommon {
  readonly kind: 'fra';
  readonly rate: number;
  /** The period as `AxB` (months from spot to the start and to the end). */
  readonly period: string;
  readonly startMonths: number;
  readonly endMonths: number;
  /** The index tenor, `nM` (B - A months): the document's field `index`. */
  readonly indexTenor: string;
  readonly dayCount: DayCount;
  readonly calendar: string;
  readonly spotLag: number;
  readonly businessDay: BusinessDayRule;
  readonly eom: boolean;
  readonly spot: IsoDate;
  readonly start: IsoDate;
  readonly end: IsoDate;
  readonly fixing: IsoDate;
  /** Start and end before the business-day rule (the quote check shows both). */
  readonly unadjustedStart: IsoDate;
  readonly unadjustedEnd: IsoDate;
  readonly calendars?: CalendarContext;
}
export type Quote = DepositQuote | BillQuote | ZeroQuote | BondQuote | SwapQuote | OisQuote | ParYieldQuote | FutureQuote | FraQuote;

export interface CurveSettings {
  readonly dayCount: CurveDayCount;
  readonly interpolation: InterpolationId;
  readonly extrapolation: Extrapolation;
  /** The parametric fit shown beside the exact bootstrap; 'none' for none. */
  readonly fit: 'none' | FitModel;
  /**
   * The model that fills the convexity adjustment of every future without a typed `convexity`
   * (instruments/convexity.ts); absent: none, such a future's adjustment is 0.
   */
  readonly futuresConvexity?: ConvexityModel;
}

/**
 * A turn (year end, quarter end): an extra overnight spread `spreadBp` (bp, simple ACT/360), or one
 * solved from the quote `solveFrom` that spans it, on the
 * overnight periods that start on a business day from `from` to `to` (both inclusive) of
 * `calendar` (absent: the first enabled quote's calendar, else `weekends`). Each such period runs to
 * the next business day, so the turn covers the calendar days from the first business day on or
 * after `from` to the business day after the last one on or before `to` (bootstrap/turns.ts).
 */
export interface Turn {
  readonly name: string;
  readonly from: IsoDate;
  readonly to: IsoDate;
  /** The spread set by the user; absent exactly when `solveFrom` is given. */
  readonly spreadBp?: number;
  /**
   * The quote whose value sets the spread, by its position in the document's `quotes` (0 for the
   * first, as in `quotes[i]`); absent exactly when `spreadBp` is given. That quote's period must
   * hold every day of the turn; it is then no node of the curve (bootstrap/turnSolve.ts). Null:
   * no quote (a workbench row that gives none), which the build refuses naming the turn.
   */
  readonly solveFrom?: number | null;
  readonly calendar?: string;
}

/**
 * Policy-meeting steps: the effective dates of policy decisions (the day the new rate applies, not
 * the announcement) and whether the curve takes a node on each (`on`): flat overnight forwards
 * between them (bootstrap/meetingSteps.ts).
 */
export interface MeetingSteps {
  readonly on: boolean;
  readonly effectiveDates: readonly IsoDate[];
}

/** A validated workspace: what the engine builds from. Reserved keys are passed through untouched. */
export interface Workspace {
  /**
   * The valuation date: discount factor 1, the curve's t axis starts here; tenors of `--at` and
   * `--forward` count from it. The document's `valuationDate` (version 2) or `settlement` (version 1).
   */
  readonly settlement: IsoDate;
  /** The document's `calendars` (edits of built-in calendars) and `customCalendars` (pasted lists); empty when it has none. */
  readonly calendars: CalendarContext;
  readonly curve: CurveSettings;
  /** Every quote that validated (enabled or not), in document order. */
  readonly quotes: readonly Quote[];
  /** Count of entries in the document's quotes array. */
  readonly quoteCount: number;
  /** The document's `turns` (absent: none, today's curve exactly). */
  readonly turns?: readonly Turn[];
  /** The document's `meetingSteps` (absent: none). */
  readonly meetingSteps?: MeetingSteps;
  /** Top-level keys reserved for the workbench (scenarios, strategy, snapshots, view, note), as given. */
  readonly reserved: Readonly<Record<string, unknown>>;
  /** The document's `fixings` (overnight rates by past business day), absent when it has none. */
  readonly fixings?: Readonly<Record<IsoDate, number>>;
  /**
   * The document's named curves besides this default one (`curves`, document/namedCurves.ts), in
   * build order; absent when it has none (every document before named curves).
   */
  readonly curves?: readonly WorkspaceCurve[];
}

export const DEFAULT_CURVE: CurveSettings = { dayCount: 'ACT/365F', interpolation: 'monotone-convex', extrapolation: 'none', fit: 'none' };
