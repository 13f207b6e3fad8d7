import { useId, useMemo } from 'react';
import { forwardBetween, type Curve, formatNumber, formatPercent, rateTag } from '../../core/index.ts';
import { useAppStore } from '../../state/store.ts';
import { setViewValues, viewList } from '../../state/viewValues.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import type { DatedCell } from './explainCell.ts';
import { OpenExplanation, useExplainOpener } from './explainOpener.tsx';

/** Rows the calculator starts with: a 3-month forward from settlement, 1y1y and 5y5y. */
const DEFAULT_STARTS = ['', '1Y', '5Y'];
const DEFAULT_ENDS = ['3M', '1Y', '5Y'];
/** At most this many rows (the document's view holds short lists). */
export const FORWARD_CALC_ROWS = 20;
const FIELD_CHARS = 20;

/**
 * Forwards between any start and end, typed as tenors or dates: the start from settlement (empty
 * for settlement), the end from the start. Rows are kept in the document's view, so they are saved,
 * undone and shared; each figure is the core's forwardBetween, in the display compounding and day
 * count. With the build, each forward opens its explanation (a forward between its two dates).
 */
export function ForwardCalculator({ curve, result }: { curve: Curve; result?: WorkbenchBuild }) {
  const doc = useAppStore((s) => s.workspace);
  const display = doc.display;
  const starts = viewList(doc, 'forwardCalcStarts', DEFAULT_STARTS);
  const ends = viewList(doc, 'forwardCalcEnds', DEFAULT_ENDS);
  const n = Math.min(starts.length, ends.length, FORWARD_CALC_ROWS);
  const rows = useMemo(
    () => Array.from({ length: n }, (_, i) => forwardBetween(curve, starts[i]!, ends[i]!, display.compounding, display.dayCount)),
    [curve, starts, ends, n, display.compounding, display.dayCount],
  );
  const tag = rateTag(display.compounding, display.dayCount);
  const id = useId();
  // Not under an edit lock: a read-only workspace still opens the figures' explanations; the inputs and buttons are locked here.
  const locked = useAppStore((st) => st.readOnly !== null);
  const explain = useExplainOpener<DatedCell>((a, b) => a.field === b.field && a.start === b.start && a.end === b.end);
  // A discount factor of row i opens its explanation (discountOn, as forwardBetween reads it).
  const df = (i: number, date: string, which: string, value: number) => {
    const text = formatNumber(value, 8);
    if (!result) return text;
    const cell: DatedCell = { field: 'discount', start: date, title: `Discount factor at the ${which} of forward ${i + 1} (${date})` };
    return explain.button(cell, text, `the discount factor at the ${which} of forward ${i + 1} (${date})`);
  };
  const write = (nextStarts: readonly string[], nextEnds: readonly string[], label: string, mergeKey?: string) =>
    setViewValues({ forwardCalcStarts: [...nextStarts.slice(0, n)], forwardCalcEnds: [...nextEnds.slice(0, n)] }, label, mergeKey);
  const edit = (i: number, which: 'start' | 'end', text: string) => {
    const t = text.slice(0, FIELD_CHARS);
    const s = [...starts.slice(0, n)];
    const e = [...ends.slice(0, n)];
    (which === 'start' ? s : e)[i] = t;
    write(s, e, `forward calculator ${which}`, `fwd-calc:${i}:${which}`);
  };
  const add = () => {
    if (n >= FORWARD_CALC_ROWS) return;
    setViewValues({ forwardCalcStarts: [...starts.slice(0, n), ''], forwardCalcEnds: [...ends.slice(0, n), '1Y'] }, 'add a forward');
  };
  const remove = (i: number) =>
    setViewValues({ forwardCalcStarts: starts.slice(0, n).filter((_, j) => j !== i), forwardCalcEnds: ends.slice(0, n).filter((_, j) => j !== i) }, 'remove a forward');
  const endEdit = () => useAppStore.getState().endEdit();
  return (
    <div className="forward-calc">
      <p className="muted small" id={`${id}-help`}>
        Start: empty for the settlement date {curve.settlement}, a tenor from settlement (1Y) or a date (YYYY-MM-DD). End: a tenor from the start (6M) or a date. Tenors are added unadjusted; a month end past the month's last day is clipped.
      </p>
      <div className="key-maturities">
      <div className="scroll-x" tabIndex={0} role="region" aria-label="Forward calculator (scrolls sideways)">
        <table className="data" aria-label="Forward calculator">
          <caption>
            Forwards between two dates <span className="tag">{tag}</span>
          </caption>
          <thead>
            <tr>
              <th scope="col">Start</th>
              <th scope="col">End</th>
              <th scope="col">Year fraction ({display.dayCount})</th>
              <th scope="col">DF start</th>
              <th scope="col">DF end</th>
              <th scope="col">
                Forward <span className="tag">{tag}</span>
              </th>
              <th scope="col">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <tr key={i}>
                <td>
                  <input aria-label={`Start of forward ${i + 1}`} aria-describedby={`${id}-help`} value={starts[i]} disabled={locked} size={8} spellCheck={false} onChange={(e) => edit(i, 'start', e.target.value)} onBlur={endEdit} />
                  {r.ok ? <span className="resolved-date">{r.value.start}</span> : null}
                </td>
                <td>
                  <input aria-label={`End of forward ${i + 1}`} aria-describedby={`${id}-help`} value={ends[i]} disabled={locked} size={8} spellCheck={false} onChange={(e) => edit(i, 'end', e.target.value)} onBlur={endEdit} />
                  {r.ok ? <span className="resolved-date">{r.value.end}</span> : null}
                </td>
                {r.ok ? (
                  <>
                    <td className="n">{formatNumber(r.value.tau, 6)}</td>
                    <td className="n">{df(i, r.value.start, 'start', r.value.dfStart)}</td>
                    <td className="n">{df(i, r.value.end, 'end', r.value.dfEnd)}</td>
                    <td className="n" data-forward={i + 1}>
                      {result ? (
                        explain.button({ field: 'forward', start: r.value.start, end: r.value.end, title: `Forward rate ${i + 1} of the calculator (${r.value.start} to ${r.value.end})` }, formatPercent(r.value.rate), `forward ${i + 1} (${r.value.start} to ${r.value.end})`)
                      ) : (
                        formatPercent(r.value.rate)
                      )}
                      {r.value.extrapolated ? <abbr title="past the last pillar: extrapolated">*</abbr> : null}
                    </td>
                  </>
                ) : (
                  <td colSpan={4} className="field-error wrap" role="alert">
                    {r.errors[0]?.message}
                  </td>
                )}
                <td>
                  <button type="button" className="icon" onClick={() => remove(i)} aria-label={`Remove forward ${i + 1}`} title="Remove this row" disabled={locked || n <= 1}>
                    ×
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {result ? <OpenExplanation result={result} display={display} cell={explain.open} onClose={explain.close} /> : null}
      </div>
      <button type="button" onClick={add} disabled={locked || n >= FORWARD_CALC_ROWS}>
        Add a forward
      </button>
      {n >= FORWARD_CALC_ROWS ? <span className="muted small"> At most {FORWARD_CALC_ROWS} rows.</span> : null}
    </div>
  );
}
