import { createContext, useContext, type ReactNode } from 'react';
import type { EffectRow, RollFigure } from '../../core/index.ts';
import type { CurveTableConventions, CurveTableRow } from '../../core/index.ts';
import { couponTag, formatBpChange, formatNumber, formatPercent, INTERPOLATORS, NO_VALUE, rateTag } from '../../core/index.ts';
import { CAUTION_TEXT } from '../../components/Caution.tsx';
import './printSummary.css';

/** Characters of the note printed; a longer note is cut with a marker. */
export const PRINT_NOTE_CHARS = 600;
/** Scenarios printed; more are counted ("and N more not shown"). */
export const PRINT_SCENARIOS = 4;

export interface PrintScenario {
  readonly name: string;
  /** What the shape does, for example "steepener 2Y–10Y spread +30 bp, pivot 5Y". */
  readonly shape: string;
  readonly space: string;
  /** Changes at the key maturities (same tenors as keyRows), or an error to print instead. */
  readonly rows: readonly EffectRow[] | null;
  readonly error?: string;
}

export interface PrintSummaryProps {
  readonly title: string;
  readonly note: string;
  readonly settlement: string;
  readonly curveDayCount: string;
  readonly interpolation: string;
  readonly extrapolation: string;
  /** The market conventions of the deposit and OIS rows (a convention set's title), absent when none. */
  readonly marketConventions?: string;
  /** The model that filled the futures' convexity adjustments, with its inputs; absent when none. */
  readonly futuresConvexity?: string;
  /** The zero-rate chart and the forward chart, drawn by the workbench. */
  readonly zeroChart: ReactNode;
  readonly forwardChart: ReactNode;
  /** Key maturities from the core's curveTable, with the conventions they are in. */
  readonly keyRows: readonly CurveTableRow[];
  readonly conventions: CurveTableConventions;
  /** The selected scenarios in order; at most PRINT_SCENARIOS are printed. */
  readonly scenarios: readonly PrintScenario[];
  /** Conventions of the scenario changes, for example "zero cont, ACT/365F; forward 3M simple, ACT/360". */
  readonly scenarioConventions: string;
  /** The curve printed, when the workspace has named curves (each section names it); absent for a workspace of one curve. */
  readonly curveName?: string;
  /** The roll-versus-term result line from its panel; null when there is none. */
  readonly rollResult: ReactNode | null;
  readonly producedAt: Date;
  /** IANA time zone the time is printed in (default: the browser's). */
  readonly timeZone?: string;
  readonly buildId: string;
  readonly workspaceHash: string;
  /**
   * On screen only (the preview): wraps a printed figure, e.g. in a button that explains it. The
   * printed page is rendered without it.
   */
  readonly figure?: (what: PrintFigure, text: string) => ReactNode;
}

/** A figure of the page: a key-maturity cell, or a scenario's change (scenario = its index among those printed). */
export type PrintFigure =
  | { readonly tenor: string; readonly field: 'discount' | 'zero' | 'par' | 'forward' }
  | { readonly scenario: number; readonly tenor: string; readonly field: 'zero' | 'forward' }
  /** A figure of the roll-versus-term table, and its name for the button ("money at the horizon of ..."). */
  | { readonly roll: RollFigure; readonly words: string };

/** The preview's figure wrapper for what the page shows of another section (the roll result); null in the printed copy. */
const PrintFigureContext = createContext<((what: PrintFigure, text: string) => ReactNode) | null>(null);
export const usePrintFigure = () => useContext(PrintFigureContext);

/** The note as printed: at most PRINT_NOTE_CHARS characters (whole code points), with a marker when cut. */
export function printedNote(note: string): { text: string; cut: boolean } {
  const chars = [...note];
  if (chars.length <= PRINT_NOTE_CHARS) return { text: note, cut: false };
  return { text: chars.slice(0, PRINT_NOTE_CHARS).join('').trimEnd(), cut: true };
}

/** Date and time with the time zone's name, for example "1 Dec 2026, 14:05 GMT-8 (America/Los_Angeles)". */
export function producedAtText(at: Date, timeZone?: string): string {
  const zone = timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone;
  const text = new Intl.DateTimeFormat('en-GB', { timeZone: zone, day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZoneName: 'shortOffset' }).format(at);
  return `${text} (${zone})`;
}

/**
 * The one-page printed summary (A4 or US Letter, portrait). Everything is text and numbers given
 * by props; nothing is read from a store. Mount it inside a PrintRoot so that printing shows it alone.
 */
export function PrintSummary(p: PrintSummaryProps) {
  const note = printedNote(p.note);
  const shown = p.scenarios.slice(0, PRINT_SCENARIOS);
  const hidden = p.scenarios.length - shown.length;
  const c = p.conventions;
  const parTag = couponTag(c.parFrequency, 'ACT/ACT-ICMA');
  const tenors = p.keyRows.map((r) => r.label);
  const fig = (what: PrintFigure, text: string): ReactNode => (p.figure && text !== NO_VALUE ? p.figure(what, text) : text);
  const on = p.curveName === undefined ? '' : ` on the curve "${p.curveName}"`;
  return (
    <article className="print-summary" aria-label="Printed summary">
      <header className="ps-head">
        <div>
          <h1>{p.title}</h1>
          <p className="ps-settings">
            {p.curveName === undefined ? null : <>Curve <strong>{p.curveName}</strong> · </>}
            Settlement <strong>{p.settlement}</strong> · curve day count {p.curveDayCount} · {methodWords(p.interpolation)} interpolation · {p.extrapolation === 'none' ? 'no extrapolation past the last pillar' : p.extrapolation === 'flat-forward' ? 'flat-forward extrapolation' : `extrapolation ${p.extrapolation}`}
            {p.marketConventions ? <> · deposits and OIS on {p.marketConventions} conventions</> : null}
            {p.futuresConvexity ? <> · futures convexity by the {p.futuresConvexity}</> : null}
          </p>
        </div>
        <dl className="ps-trace">
          <dt>Produced</dt>
          <dd>{producedAtText(p.producedAt, p.timeZone)}</dd>
          <dt>Build</dt>
          <dd>{p.buildId}</dd>
          <dt>Workspace</dt>
          <dd>{p.workspaceHash}</dd>
        </dl>
      </header>
      {p.note.trim() !== '' && (
        <section className="ps-note" aria-label="Note">
          {note.text}
          {note.cut && <span className="ps-cut"> [… note cut at {PRINT_NOTE_CHARS} characters]</span>}
        </section>
      )}
      <section className="ps-charts">
        <figure>{p.zeroChart}</figure>
        <figure>{p.forwardChart}</figure>
      </section>
      <div className="ps-tables">
        <section>
          <h2>Key maturities{on}</h2>
          <table className="ps-table">
            <thead>
              <tr>
                <th>Tenor</th>
                <th>Date</th>
                <th>t <span className="ps-unit">(yr, {p.curveDayCount})</span></th>
                <th>DF</th>
                <th>Zero <span className="ps-unit">({rateTag(c.zeroCompounding, c.zeroDayCount)})</span></th>
                <th>Par <span className="ps-unit">({parTag})</span></th>
                <th>Fwd {c.forwardTenor} <span className="ps-unit">({rateTag(c.forwardCompounding, c.forwardDayCount)})</span></th>
              </tr>
            </thead>
            <tbody>
              {p.keyRows.map((r) => (
                <tr key={r.label}>
                  <th scope="row">{r.label}</th>
                  <td>{r.date}</td>
                  <td>{formatNumber(r.t, 3)}</td>
                  <td>{fig({ tenor: r.label, field: 'discount' }, formatNumber(r.discount, 6))}</td>
                  <td>{fig({ tenor: r.label, field: 'zero' }, formatPercent(r.zero))}</td>
                  <td>{fig({ tenor: r.label, field: 'par' }, formatPercent(r.par))}</td>
                  <td>{fig({ tenor: r.label, field: 'forward' }, formatPercent(r.forward))}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
        <section>
          <h2>Scenarios{on} <span className="ps-unit">(change in bp; {p.scenarioConventions})</span></h2>
          {shown.length === 0 ? (
            <p className="ps-muted">No scenario selected.</p>
          ) : (
            <>
              <ol className="ps-scenario-list">
                {shown.map((s, i) => (
                  <li key={i}>
                    <strong>{s.name}</strong>: {s.shape}; moves the {s.space}
                    {s.error ? <span className="ps-error"> — not computed: {s.error}</span> : null}
                  </li>
                ))}
              </ol>
              <table className="ps-table ps-scen">
                <thead>
                  <tr>
                    <th rowSpan={2}>Tenor</th>
                    {shown.map((s, i) => (
                      <th key={i} colSpan={2}>
                        {i + 1}. {s.name}
                      </th>
                    ))}
                  </tr>
                  <tr>
                    {shown.map((_, i) => [<th key={`z${i}`}>zero</th>, <th key={`f${i}`}>fwd</th>])}
                  </tr>
                </thead>
                <tbody>
                  {tenors.map((t) => (
                    <tr key={t}>
                      <th scope="row">{t}</th>
                      {shown.map((s, i) => {
                        const row = s.rows?.find((r) => r.tenor === t) ?? null;
                        return [
                          <td key={`z${i}`}>{fig({ scenario: i, tenor: t, field: 'zero' }, formatBpChange(row?.zeroBp))}</td>,
                          <td key={`f${i}`}>{fig({ scenario: i, tenor: t, field: 'forward' }, formatBpChange(row?.forwardBp))}</td>,
                        ];
                      })}
                    </tr>
                  ))}
                </tbody>
              </table>
            </>
          )}
          {hidden > 0 && <p className="ps-more">and {hidden} more not shown</p>}
        </section>
      </div>
      <section className="ps-roll" aria-label="Roll versus term">
        <h2>Roll versus term{on}</h2> <div className="ps-roll-body">{p.rollResult ? <PrintFigureContext.Provider value={p.figure ? fig : null}>{p.rollResult}</PrintFigureContext.Provider> : <span className="ps-muted">no result</span>}</div>
      </section>
      <p className="ps-caution" role="note">
        <strong>Caution.</strong> {CAUTION_TEXT}
      </p>
    </article>
  );
}

/** An interpolation method by its label ("Monotone convex"), not its identifier. */
function methodWords(id: string): string {
  const known = (INTERPOLATORS as Readonly<Record<string, { label: string } | undefined>>)[id];
  return known ? known.label : id;
}
