import { buildCurve, type CurveBuild } from '../bootstrap/build.ts';
import type { Curve } from '../curve/curve.ts';
import type { ExplanationSink } from '../curve/explain.ts';
import { zeroOn } from '../curve/query.ts';
import { fnv1a64 } from '../export/hash.ts';
import type { Compounding } from '../rates/compounding.ts';
import type { CurveDayCount } from '../time/dayCount.ts';
import type { IsoDate } from '../time/date.ts';
import { marketDate } from '../time/dateConventions.ts';
import { parseTenor } from '../time/tenor.ts';
import { WORKSPACE_FORMAT, WORKSPACE_VERSION } from '../document/validate.ts';

/**
 * A snapshot freezes the inputs of a workspace under a name: settlement, curve settings and the
 * quotes as typed. It never stores results: the curve is rebuilt from the inputs, and the short
 * hash of the curve built when the snapshot was taken says whether this build rebuilds it the same.
 */
export interface Snapshot {
  readonly name: string;
  /** When it was taken, as the workbench gives it (ISO 8601 with offset); never read from a clock here. */
  readonly takenAt: string;
  readonly settlement: IsoDate;
  readonly curve: unknown;
  readonly quotes: readonly unknown[];
  /** curveHash of the curve built when the snapshot was taken; null when it did not build. */
  readonly curveHash: string | null;
}

/**
 * Short hash of a built curve: FNV-1a 64 (first 12 hex digits) of its settings and each pillar's date
 * and discount factor to 12 significant digits, so a different rebuild (another method, a changed
 * solver) shows while last-digit noise of the platform's exp and log does not.
 */
export function curveHash(curve: Curve): string {
  const text = [curve.settlement, curve.dayCount, curve.interpolation, curve.extrapolation, ...curve.pillars.map((p) => `${p.date}=${p.discount.toPrecision(12)}`)].join(';');
  return fnv1a64(text).slice(0, 12);
}

/** The workspace document the snapshot's inputs make (without scenarios, note or view). */
export function snapshotDocument(s: Snapshot): Record<string, unknown> {
  return { format: WORKSPACE_FORMAT, version: WORKSPACE_VERSION, valuationDate: s.settlement, ...(s.curve === undefined ? {} : { curve: s.curve }), quotes: s.quotes };
}

/** Takes a snapshot of a parsed workspace document: copies its inputs and the hash of the curve it builds now. */
export function takeSnapshot(doc: Record<string, unknown>, name: string, takenAt: string): Snapshot {
  const quotes = Array.isArray(doc.quotes) ? (JSON.parse(JSON.stringify(doc.quotes)) as unknown[]) : [];
  const curve = doc.curve === undefined ? undefined : (JSON.parse(JSON.stringify(doc.curve)) as unknown);
  const base = { name, takenAt, settlement: String(doc.valuationDate ?? doc.settlement), curve, quotes, curveHash: null };
  const built = buildCurve(snapshotDocument(base));
  return { ...base, curveHash: built.curve ? curveHash(built.curve) : null };
}

export interface SnapshotRebuild {
  readonly build: CurveBuild;
  /** Hash of the curve this build makes; null when it does not build. */
  readonly hash: string | null;
  /** True when the snapshot carries a hash and this build's hash differs (a newer build rebuilds it differently). */
  readonly changed: boolean;
}

/** Rebuilds a snapshot's curve from its inputs and compares the hash with the stored one. */
export function rebuildSnapshot(s: Snapshot): SnapshotRebuild {
  const build = buildCurve(snapshotDocument(s));
  const hash = build.curve ? curveHash(build.curve) : null;
  return { build, hash, changed: s.curveHash !== null && hash !== s.curveHash };
}

/** How two curves with different settlements are lined up: same time to maturity (default) or same calendar date. */
export type CompareBy = 'time' | 'date';

export interface CompareRow {
  readonly tenor: string;
  /** Date on the current curve. */
  readonly date: IsoDate;
  /** Date read on the other curve: the same date, or its own settlement plus the tenor. */
  readonly otherDate: IsoDate;
  readonly zero: number | null;
  readonly otherZero: number | null;
  /** (zero - otherZero) x 10,000, bp. */
  readonly differenceBp: number | null;
}

/**
 * Zero rates of `current` against `other` at key tenors, in compounding c and day count dc.
 * By 'time' each curve is read at its own settlement plus the tenor (same time to maturity); by
 * 'date' both are read on the current curve's date (the other's zero runs from its own settlement).
 */
export function compareCurves(current: Curve, other: Curve, tenors: readonly string[], by: CompareBy, c: Compounding, dc: CurveDayCount): CompareRow[] {
  return tenors.flatMap((label) => compareRow(current, other, label, by, c, dc) ?? []);
}

/**
 * One row of compareCurves (null when `label` is not a tenor). With sinks, each curve's zero rate
 * hands its own values to its sink (explainCurveDifference), through the same reads.
 */
export function compareRow(current: Curve, other: Curve, label: string, by: CompareBy, c: Compounding, dc: CurveDayCount, sinks?: { readonly current: ExplanationSink; readonly other: ExplanationSink }): CompareRow | null {
  const tenor = parseTenor(label);
  if (!tenor) return null;
  const date = marketDate(current.settlement, tenor);
  const otherDate = by === 'time' ? marketDate(other.settlement, tenor) : date;
  const z = zeroOn(current, date, c, dc, 'date', sinks?.current);
  const o = otherDate > other.settlement ? zeroOn(other, otherDate, c, dc, 'date', sinks?.other) : null;
  const zero = z.ok ? z.value.zero : null;
  const otherZero = o && o.ok ? o.value.zero : null;
  return { tenor: label, date, otherDate, zero, otherZero, differenceBp: zero === null || otherZero === null ? null : (zero - otherZero) * 1e4 };
}
