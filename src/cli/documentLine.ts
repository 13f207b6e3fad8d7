import type { Compounding, CoreWarning, CurveDayCount, Extrapolation, InterpolationId, IsoDate, Quote, QuoteUnit } from '../core/index.ts';

/** One `points` entry of a built document: t in years on the curve's day count, zero in the asked compounding and day count. */
export interface PointOut {
  readonly date: IsoDate;
  readonly t: number;
  readonly discount: number;
  readonly zero: number;
  readonly extrapolated?: true;
  /** With --explain: how the zero rate (and the discount factor it is read from) comes about. */
  readonly explain?: object;
}

/** One `forwards` entry: tau in years on the asked day count, rate in the asked compounding and day count. */
export interface ForwardOut {
  readonly start: IsoDate;
  readonly end: IsoDate;
  readonly tau: number;
  readonly rate: number;
  readonly extrapolated?: true;
  /** With --explain: how the forward comes about. */
  readonly explain?: object;
}

/** One `quotes` entry: t in years on the curve's day count; repricingError in `unit` (price per 100, or rate). */
export interface QuoteOut {
  readonly index: number;
  readonly kind: Quote['kind'];
  readonly maturity: IsoDate;
  readonly t: number;
  readonly unit: QuoteUnit;
  readonly repricingError: number;
  /** The quote's start, adjusted accrual end and curve node date (ISO dates). */
  readonly start: IsoDate;
  readonly end: IsoDate;
  readonly pillar: IsoDate;
  /** The last payment date: swaps and overnight-index swaps only (null: not printed). */
  readonly payment: IsoDate | null;
  /** The index's fixing date: FRAs only (absent: not printed). */
  readonly fixing?: IsoDate;
}

/**
 * A built document's output record, fields in the contract's order. Its text fields are typed as
 * ISO dates and the engine's identifiers: the strings builtDocumentLine writes without escaping.
 */
export interface BuiltDocument {
  readonly index: number;
  /** The valuation date under the name version 1 gave it (kept for readers of the first output). */
  readonly settlement: IsoDate;
  readonly valuationDate: IsoDate;
  readonly interpolation: InterpolationId;
  readonly curveDayCount: CurveDayCount;
  readonly compounding: Compounding;
  readonly rateDayCount: CurveDayCount;
  readonly extrapolation: Extrapolation;
  readonly quotes: readonly QuoteOut[];
  readonly points: readonly PointOut[];
  readonly forwards: readonly ForwardOut[];
  readonly bonds?: readonly object[];
  /** The document's turns with the spread each took, when one is solved from a quote (turnsOutput in curveCommand.ts). */
  readonly turns?: readonly object[];
  readonly warnings: readonly CoreWarning[];
  /** The document's named curves, each under its name (only when it has some; namedCurveOutput in curveCommand.ts). */
  readonly curves?: Readonly<Record<string, object>>;
}

/**
 * The compact JSON text of a built document: exactly `JSON.stringify(doc)` (checked by the
 * command's tests over random markets and options), written field by field.
 *
 * Why by hand: a document is about 9 KB, mostly 170 doubles and 120 short strings, and Node 20's
 * JSON.stringify took about 40 us for it, a fifth of the command's time per document; this takes
 * about 16 us. The numbers are formatted by the same shortest round-trip conversion that
 * JSON.stringify uses (the caller has checked them finite). The strings written without escaping
 * are ISO dates the engine validated or resolved (digits and hyphens) and identifiers from the
 * engine's fixed lists; everything else (warnings, bond analytics) goes through JSON.stringify.
 */
export function builtDocumentLine(o: BuiltDocument): string {
  let s = `{"index":${o.index},"settlement":"${o.settlement}","valuationDate":"${o.valuationDate}","interpolation":"${o.interpolation}","curveDayCount":"${o.curveDayCount}","compounding":"${o.compounding}","rateDayCount":"${o.rateDayCount}","extrapolation":"${o.extrapolation}","quotes":[`;
  // A point at a pillar has the pillar's t, which its quote has just printed: each double's text
  // costs about 0.1 us to make, so the quote's text is reused when the two are the same number.
  const { quotes, points } = o;
  const tText: string[] = new Array<string>(quotes.length);
  for (let i = 0; i < quotes.length; i++) {
    const q = quotes[i]!;
    const t = `${q.t}`;
    tText[i] = t;
    s += `${i === 0 ? '' : ','}{"index":${q.index},"kind":"${q.kind}","maturity":"${q.maturity}","t":${t},"unit":"${q.unit}","repricingError":${q.repricingError},"start":"${q.start}","end":"${q.end}","pillar":"${q.pillar}"${q.payment === null ? '' : `,"payment":"${q.payment}"`}${q.fixing === undefined ? '' : `,"fixing":"${q.fixing}"`}}`;
  }
  s += '],"points":[';
  for (let i = 0; i < points.length; i++) {
    const p = points[i]!;
    const t = i < quotes.length && p.t === quotes[i]!.t ? tText[i]! : `${p.t}`;
    s += `${i === 0 ? '' : ','}{"date":"${p.date}","t":${t},"discount":${p.discount},"zero":${p.zero}${p.extrapolated ? ',"extrapolated":true' : ''}${p.explain === undefined ? '' : `,"explain":${JSON.stringify(p.explain)}`}}`;
  }
  s += '],"forwards":[';
  for (let i = 0; i < o.forwards.length; i++) {
    const f = o.forwards[i]!;
    s += `${i === 0 ? '' : ','}{"start":"${f.start}","end":"${f.end}","tau":${f.tau},"rate":${f.rate}${f.extrapolated ? ',"extrapolated":true' : ''}${f.explain === undefined ? '' : `,"explain":${JSON.stringify(f.explain)}`}}`;
  }
  s += ']';
  if (o.bonds !== undefined) s += `,"bonds":${JSON.stringify(o.bonds)}`;
  if (o.turns !== undefined) s += `,"turns":${JSON.stringify(o.turns)}`;
  s += `,"warnings":${o.warnings.length === 0 ? '[]' : JSON.stringify(o.warnings)}`;
  return o.curves === undefined ? `${s}}` : `${s},"curves":${JSON.stringify(o.curves)}}`;
}
