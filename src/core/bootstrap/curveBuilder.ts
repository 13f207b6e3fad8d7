import type { Instrument } from '../instruments/instrument.ts';
import type { Quote, Workspace } from '../document/types.ts';
import { validateWorkspace } from '../document/validate.ts';
import { buildValidated, compileMarket, type BuildOptions, type CompiledMarket, type CurveBuild } from './build.ts';

/**
 * How a CurveBuilder made its last build:
 * - `requoted`: the market compiled for an earlier document, each instrument re-quoted with its
 *   new value (`Instrument.requote`; the same instrument when its value did not move);
 * - `compiled`: the market compiled afresh (`compileMarket`);
 * - `refused`: the document did not validate, so no market was made.
 */
export type BuildPath = 'requoted' | 'compiled' | 'refused';

/** What the market was compiled from, and which field of each quote its instrument read. */
interface CompiledFrom {
  readonly settlement: Workspace['settlement'];
  readonly dayCount: Workspace['curve']['dayCount'];
  readonly skipDuplicates: boolean;
  readonly quotes: readonly Quote[];
  /** By quote index: the quoted field its instrument read (`Instrument.field`); absent for quotes without one. */
  readonly fieldOf: readonly (string | undefined)[];
  readonly market: CompiledMarket;
}

/**
 * Builds documents as `buildCurve` does, keeping the last compiled market (schedules, curve
 * times, sort order, duplicate checks) so that a document that differs from the last one only in
 * quoted values (a rate, a price, a yield typed into one cell; a batch of the same market at
 * other quotes) is validated and bootstrapped but not compiled again. The interpolation and
 * extrapolation do not enter the market, so a change of method reuses it too.
 *
 * The market is reused when the settlement, the curve day count and the skip choice are the same
 * and every validated quote equals the last one's in every field except the one its instrument
 * reads its value from; anything else (a kind, a maturity, a convention, a row switched on or
 * off, a quote left out as invalid or duplicate) compiles afresh. Either way the build is the one
 * `buildCurve` gives for the same document, bit for bit (test/core/bootstrap/curveBuilder.test.ts).
 * A re-quoted instrument keeps the `quote` object it was compiled from; its value is `market`.
 *
 * Each builder owns its cache (one market); create one per stream of related documents.
 */
export class CurveBuilder {
  private from: CompiledFrom | null = null;
  private path: BuildPath | null = null;
  private readonly tally = { requoted: 0, compiled: 0, refused: 0 };

  /** buildCurve(doc, options), reusing the last market when only quoted values moved. */
  build(doc: unknown, options: BuildOptions = {}): CurveBuild {
    this.path = 'refused';
    const build = buildValidated(validateWorkspace(doc, options.readCurves), options, (ws, skip) => this.marketOf(ws, skip));
    this.tally[this.path]++;
    return build;
  }

  /** How the last build was made (null before the first). */
  get lastPath(): BuildPath | null {
    return this.path;
  }

  /** How many builds took each path since the builder was created. */
  get counts(): Readonly<Record<BuildPath, number>> {
    return { ...this.tally };
  }

  private marketOf(ws: Workspace, skipDuplicates: boolean): CompiledMarket {
    const from = this.from;
    if (from && from.settlement === ws.settlement && from.dayCount === ws.curve.dayCount && from.skipDuplicates === skipDuplicates && sameButValues(from, ws.quotes)) {
      this.path = 'requoted';
      return requoted(from.market, ws.quotes, ws.quoteCount);
    }
    this.path = 'compiled';
    const market = compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, skipDuplicates);
    const fieldOf: (string | undefined)[] = [];
    for (const ins of market.instruments) fieldOf[ins.index] = ins.field;
    this.from = { settlement: ws.settlement, dayCount: ws.curve.dayCount, skipDuplicates, quotes: ws.quotes, fieldOf, market };
    return market;
  }
}

/** Whether `quotes` equal the compiled ones in every field except each instrument's quoted value. */
function sameButValues(from: CompiledFrom, quotes: readonly Quote[]): boolean {
  const old = from.quotes;
  if (old.length !== quotes.length) return false;
  for (let i = 0; i < quotes.length; i++) {
    const a = old[i]! as unknown as Record<string, unknown>;
    const b = quotes[i]! as unknown as Record<string, unknown>;
    if (a.index !== b.index || a.kind !== b.kind) return false;
    const value = from.fieldOf[a.index as number];
    // Quotes of one kind carry the same fields (validation writes them all): comparing a's suffices.
    // Object.is: a coupon of -0 is not the coupon 0 it would be compiled as.
    for (const k in a) {
      if (!Object.is(a[k], b[k]) && (k !== value || typeof b[k] !== 'number')) return false;
    }
  }
  return true;
}

/** The market with each instrument re-quoted at its quote's value in `quotes` (same order, same errors). */
function requoted(market: CompiledMarket, quotes: readonly Quote[], quoteCount: number): CompiledMarket {
  const byIndex: (Quote | undefined)[] = new Array(quoteCount);
  for (const q of quotes) byIndex[q.index] = q;
  const instruments: Instrument[] = [];
  for (const ins of market.instruments) {
    const value = (byIndex[ins.index] as unknown as Record<string, number>)[ins.field]!;
    instruments.push(Object.is(value, ins.market) ? ins : ins.requote(value));
  }
  return { ...market, instruments };
}
