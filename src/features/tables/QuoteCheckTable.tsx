import { useMemo } from 'react';
import type { Curve, Quote, Repricing } from '../../core/index.ts';
import { PRICE_ACCEPTANCE, quoteConvention, quoteConventionTag, quoteSchedule, RATE_ACCEPTANCE, type QuoteSchedule, formatNumber, formatQuotePrice, formatQuoteRate, nearZero } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { OpenExplanation, useExplainOpener } from './explainOpener.tsx';
import type { QuoteCheckCell } from './explainQuoteCell.ts';

const sameQuoteCell = (a: QuoteCheckCell, b: QuoteCheckCell): boolean => a.quoteCheck.index === b.quoteCheck.index && a.quoteCheck.figure === b.quoteCheck.figure;

const showQuote = (r: Repricing, v: number): string => (r.unit === 'price' ? formatQuotePrice(v) : formatQuoteRate(v));
/**
 * Repricing error: bp for a rate quote, per 100 face for a price quote. Anything inside the
 * bootstrap's acceptance (RATE_ACCEPTANCE, PRICE_ACCEPTANCE) is an exact reprice and shows as zero,
 * with the computed value and the tolerance in its tooltip.
 */
const showError = (r: Repricing): { text: string; title: string | undefined } => {
  const e = r.unit === 'price' ? nearZero(r.repricingError, 6, 'per 100 face', PRICE_ACCEPTANCE) : nearZero(r.repricingError * 1e4, 4, 'bp', RATE_ACCEPTANCE * 1e4);
  return { text: `${e.text} ${r.unit === 'price' ? 'per 100' : 'bp'}`, title: e.title };
};

/** Every quote against the curve: implied quote, repricing error, pillar date, t; a schedule for bonds and swaps. */
export function QuoteCheckTable({ result }: { result: WorkbenchBuild }) {
  const rows = useAppStore((s) => s.workspace.quotes);
  const selectedRowId = useAppStore((s) => s.selectedRowId);
  const selectRow = useAppStore((s) => s.selectRow);
  const display = useAppStore((s) => s.workspace.display);
  const explain = useExplainOpener<QuoteCheckCell>(sameQuoteCell);
  const { build, conversion } = result;
  // The open figure follows the table: closed when its quote leaves the curve.
  const open = explain.open && build.repricing.some((r) => r.index === explain.open!.quoteCheck.index) ? explain.open : null;
  /** A figure that opens its explanation (Enter or a click); `label` names it for a screen reader. */
  const figure = (rep: Repricing, which: QuoteCheckCell['quoteCheck']['figure'], text: string, label: string) => {
    const cell: QuoteCheckCell = { quoteCheck: { index: rep.index, figure: which } };
    return explain.button(cell, text, label);
  };
  const byRow = new Map<number, Repricing>();
  for (const r of build.repricing) {
    const row = conversion.rowOfQuote[r.index];
    if (row !== undefined) byRow.set(row, r);
  }
  const quoteByIndex = new Map<number, Quote>((build.workspace?.quotes ?? []).map((q) => [q.index, q]));
  const leftOut = new Map(build.leftOut.map((l) => [l.index, l]));
  const selectedIndex = rows.findIndex((r) => r.id === selectedRowId);
  return (
    <div className="quote-check">
      <div className="scroll-y" tabIndex={0} role="region" aria-label="Quote check (scrolls)">
        <table className="data" aria-label="Quote check">
          <caption>Each quote repriced on the built curve; choose a bond, swap, par yield, future or FRA row to see its schedule; a figure, how it is made.</caption>
          <thead>
            <tr>
              <th scope="col">Row</th>
              <th scope="col">Kind</th>
              <th scope="col">Pillar date</th>
              <th scope="col">t (years, {build.curve?.dayCount ?? ''})</th>
              <th scope="col">Quoted as</th>
              <th scope="col">Market</th>
              <th scope="col">Implied by curve</th>
              <th scope="col">Repricing error</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((row, i) => {
              const rep = byRow.get(i);
              const qi = conversion.rowOfQuote.indexOf(i);
              const q = qi >= 0 ? quoteByIndex.get(qi) : undefined;
              const lo = qi >= 0 ? leftOut.get(qi) : undefined;
              const status = !rep ? (lo ? lo.message.replace(/quotes\[\d+\]/, `row ${i + 1}`) : conversion.rows[i]?.blank ? 'empty row' : 'not in the curve: fix the marked cells') : null;
              return (
                <tr key={row.id} className={row.id === selectedRowId ? 'selected' : ''}>
                  <th scope="row">
                    <button type="button" className="linklike" onClick={() => selectRow(row.id)} aria-pressed={row.id === selectedRowId}>
                      {i + 1}
                    </button>
                  </th>
                  <td>{q?.kind ?? row.kind}</td>
                  {rep && q ? (
                    <>
                      <td>{rep.maturity}</td>
                      <td className="n">{formatNumber(rep.t, 6)}</td>
                      <td>
                        {rep.field} <span className="tag">{quoteConventionTag(quoteConvention(q))}</span>
                      </td>
                      <td className="n">{showQuote(rep, rep.market)}</td>
                      <td className="n">{figure(rep, 'model', showQuote(rep, rep.model), `the model ${rep.field} of row ${i + 1}`)}</td>
                      <td className="n" title={showError(rep).title}>{figure(rep, 'error', showError(rep).text, `the repricing error of row ${i + 1}`)}</td>
                    </>
                  ) : (
                    <td colSpan={6} className="muted">
                      {status}
                    </td>
                  )}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <OpenExplanation result={result} display={display} cell={open} onClose={explain.close} />
      {selectedIndex >= 0 && <ScheduleView rowNumber={selectedIndex + 1} quote={quoteByIndex.get(conversion.rowOfQuote.indexOf(selectedIndex))} curve={build.curve} settlement={build.workspace?.settlement ?? ''} />}
    </div>
  );
}

function ScheduleView({ rowNumber, quote, curve, settlement }: { rowNumber: number; quote: Quote | undefined; curve: Curve | null; settlement: string }) {
  const schedule: QuoteSchedule | null = useMemo(() => {
    if (!quote) return null;
    return quoteSchedule(quote, settlement, curve);
  }, [quote, curve, settlement]);
  if (!quote) return <p className="muted">Row {rowNumber} is not a valid quote yet.</p>;
  if (!schedule) return <p className="muted">Row {rowNumber} is a {quote.kind}: a single flow at {quote.maturity}, no schedule.</p>;
  const dc = schedule.dayCount ?? ('dayCount' in quote ? quote.dayCount : '');
  // Days of an averaged future show the business day whose rate each carries.
  const fixing = schedule.rows.some((r) => r.fixingDate !== undefined);
  // Periods a calendar moves show their accrual end (and an FRA its start) before and after the business-day rule.
  const moved = schedule.rows.some((r) => r.accrualEnd !== undefined);
  const movedStart = schedule.rows.some((r) => r.unadjustedStart !== undefined);
  const daily = fixing && schedule.fixing !== 'index';
  return (
    <div className="schedule">
      <table className="data" aria-label={`Schedule of row ${rowNumber}`}>
        <caption>
          Row {rowNumber}: {quote.kind} maturing {quote.maturity}, {schedule.note}
        </caption>
        <thead>
          <tr>
            {movedStart && <th scope="col">Period start, unadjusted</th>}
            <th scope="col">{movedStart ? 'Period start, adjusted' : 'Period start'}</th>
            {moved && <th scope="col">Accrual end, unadjusted</th>}
            {moved && <th scope="col">Accrual end, adjusted</th>}
            <th scope="col">{daily ? 'Day end' : 'Payment date'}</th>
            {fixing && <th scope="col">{daily ? 'Rate of (fixing date)' : 'Index fixing date'}</th>}
            <th scope="col">Year fraction ({dc})</th>
            <th scope="col">Cash flow (per 100)</th>
            <th scope="col">t (years)</th>
            <th scope="col">Discount factor</th>
            <th scope="col">Present value (per 100)</th>
          </tr>
        </thead>
        <tbody>
          {schedule.rows.map((r) => (
            <tr key={r.end}>
              {movedStart && <td>{r.unadjustedStart}</td>}
              <td className={movedStart && r.unadjustedStart !== r.start ? 'moved-date' : undefined}>{r.start}</td>
              {moved && <td>{r.unadjustedAccrualEnd}</td>}
              {moved && <td className={r.unadjustedAccrualEnd !== r.accrualEnd ? 'moved-date' : undefined}>{r.accrualEnd}</td>}
              <td>{r.end}</td>
              {fixing && <td className={r.fixingDate !== r.start ? 'moved-date' : undefined}>{r.fixingDate}</td>}
              <td className="n">{formatNumber(r.yearFraction, 8)}</td>
              <td className="n">{formatNumber(r.cashFlow, 6)}</td>
              <td className="n">{formatNumber(r.t, 6)}</td>
              <td className="n">{formatNumber(r.discount, 8)}</td>
              <td className="n">{formatNumber(r.presentValue, 6)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
