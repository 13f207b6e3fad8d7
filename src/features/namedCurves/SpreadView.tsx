import { useId, useMemo } from 'react';
import { bpFigure, curveSpreadAt, formatDate, formatPercent, marketDate, parseTenor, rateTag, type Curve, type SpreadMeasure, type WorkbenchCurves } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { sampleGridFor, type SamplePoint } from '../../hooks/useCurveSeries.ts';
import { RateChart } from '../../charts/RateChart.tsx';
import { BASE_STYLES } from '../../charts/palette.ts';
import { setViewValues } from '../../state/viewValues.ts';
import { useAppStore } from '../../state/store.ts';
import { curveChoice, DEFAULT_NAME, VIEW_KEYS } from './curveChoice.ts';
import { OpenExplanation, useExplainOpener } from '../tables/explainOpener.tsx';
import type { SpreadCell } from './explainSpreadCell.ts';

/** The maturities the spread table reads, from the valuation date. */
const SPREAD_TENORS = ['3M', '6M', '1Y', '2Y', '3Y', '5Y', '7Y', '10Y', '15Y', '20Y', '30Y'] as const;

/**
 * The spread between any two curves of the workspace (the default curve and the named curves
 * that built): zero rates, or forwards of the display's forward tenor, of the first curve minus
 * the second at each maturity, in bp, both rates in the display's compounding and day count
 * (curveSpreadAt in the core computes every figure).
 */
export function SpreadView({ result, named }: { result: WorkbenchBuild; named: WorkbenchCurves }) {
  const id = useId();
  const view = useAppStore((s) => s.workspace.view);
  const display = useAppStore((s) => s.workspace.display);
  const readOnly = useAppStore((s) => s.readOnly !== null);
  const curves = useMemo(() => {
    const out = new Map<string, Curve>();
    if (result.build.curve) out.set('', result.build.curve);
    for (const c of named.curves) if (c.build.curve) out.set(c.name, c.build.curve);
    return out;
  }, [result.build.curve, named]);
  const choice = curveChoice(view, named.curves.map((c) => c.name));
  const a = curves.get(choice.of);
  const b = curves.get(choice.over);
  // One value per forward tenor, so the two memos below do not run again on every render (a bad tenor reads as 3M, as in the tables).
  const tenor = useMemo(() => parseTenor(display.forwardTenor) ?? { n: 3, unit: 'M' as const }, [display.forwardTenor]);
  const rows = useMemo(() => {
    if (!a || !b) return [];
    const dates = SPREAD_TENORS.map((t) => marketDate(a.settlement, parseTenor(t)!));
    const points = curveSpreadAt(a, b, choice.measure, dates, display.compounding, display.dayCount, tenor);
    return SPREAD_TENORS.map((t, i) => ({ tenor: t, date: dates[i]!, point: points.find((p) => p.date === dates[i]) ?? null }));
  }, [a, b, choice.measure, display.compounding, display.dayCount, tenor]);
  // The chart: the spread at every date of the zero chart's sample grid of the first curve (400
  // dates to its chart end), as curveSpreadAt gives it; past either curve's last pillar (in years
  // on each curve's own clock) dashed.
  const lastT = a && b ? Math.min(a.lastT, b.lastT) : 0;
  const points = useMemo(
    (): SamplePoint[] => (a && b ? curveSpreadAt(a, b, choice.measure, sampleGridFor(a, display).dates, display.compounding, display.dayCount, tenor).map((p) => ({ date: p.date, x: p.x, y: p.bp, extrapolated: p.x > lastT })) : []),
    [a, b, choice.measure, display, tenor, lastT],
  );
  const label = (name: string): string => (name === '' ? DEFAULT_NAME : name);
  const tag = rateTag(display.compounding, display.dayCount);
  const what = choice.measure === 'zero' ? 'zero rate' : `${display.forwardTenor} forward`;
  const title = `Spread of ${label(choice.of)} over ${label(choice.over)}, ${what}s`;
  const yLabel = `Spread (bp, ${what}s, ${tag})`;
  const select = (key: string, value: string, text: string, name: string) => (
    <select id={`${id}-${key}`} aria-label={name} value={value} disabled={readOnly} onChange={(e) => setViewValues({ [key]: e.target.value }, 'Change the spread')}>
      {[...curves.keys()].map((n) => (
        <option key={n} value={n}>
          {label(n)}
        </option>
      ))}
      {!curves.has(value) && <option value={value}>{text}</option>}
    </select>
  );
  const missing = rows.filter((r) => r.point === null).length;
  // A spread figure opens its explanation beside the table; the open one follows the curves as they are now.
  const explain = useExplainOpener<SpreadCell>((x, y) => x.spread.of === y.spread.of && x.spread.over === y.spread.over && x.spread.measure === y.spread.measure && x.spread.tenor === y.spread.tenor && x.spread.side === y.spread.side);
  const cellAt = (t: string, side?: 'of' | 'over'): SpreadCell => ({ spread: { of: choice.of, over: choice.over, measure: choice.measure, tenor: t, named, inputs: useAppStore.getState().workspace, ...(side ? { side } : {}) } });
  /** One curve's rate beside the spread, opening its own explanation. */
  const rate = (t: string, side: 'of' | 'over', x: number) => explain.button(cellAt(t, side), formatPercent(x), `the ${label(choice[side])} ${what} at ${t}`, openCell !== null);
  const open = explain.open;
  const openCell = useMemo(
    () => (open && open.spread.of === choice.of && open.spread.over === choice.over && open.spread.measure === choice.measure ? { spread: { ...open.spread, named, inputs: useAppStore.getState().workspace } } : null),
    [open, named, choice.of, choice.over, choice.measure],
  );
  return (
    <section className="panel spread-panel" aria-labelledby={`${id}-title`}>
      <div className="panel-head">
        <h2 id={`${id}-title`}>Spread between curves</h2>
        <label htmlFor={`${id}-${VIEW_KEYS.of}`}>Curve</label>
        {select(VIEW_KEYS.of, choice.of, 'not built', 'Spread of the curve')}
        <label htmlFor={`${id}-${VIEW_KEYS.over}`}>minus</label>
        {select(VIEW_KEYS.over, choice.over, 'not built', 'Spread over the curve')}
        <label htmlFor={`${id}-${VIEW_KEYS.measure}`}>of</label>
        <select id={`${id}-${VIEW_KEYS.measure}`} aria-label="Spread of zero rates or forwards" value={choice.measure} disabled={readOnly} onChange={(e) => setViewValues({ [VIEW_KEYS.measure]: e.target.value as SpreadMeasure }, 'Change the spread')}>
          <option value="zero">zero rates</option>
          <option value="forward">{display.forwardTenor} forwards</option>
        </select>
      </div>
      {!a || !b ? (
        <p className="empty">No spread: the curve {!a ? label(choice.of) : label(choice.over)} did not build (see its problems above the sheet).</p>
      ) : (
        <>
          {points.length > 1 && (
            <RateChart
              name={title}
              description={yLabel}
              lines={[{ id: 'spread', label: 'Spread', tag, ...BASE_STYLES.zero, points }]}
              xMax={points[points.length - 1]!.x}
              lastT={lastT}
              axis={display.axis}
              xLabel={`Maturity (years, ${a.dayCount})`}
              yLabel={yLabel}
              bp
            />
          )}
          <div className="table-scroll" tabIndex={0} role="region" aria-label="Spread table (scrolls sideways)">
            <table className="data" aria-label={title}>
              <thead>
                <tr>
                  <th scope="col">Maturity</th>
                  <th scope="col">{choice.measure === 'zero' ? 'Date' : 'Start'}</th>
                  <th scope="col">
                    {label(choice.of)} {what} <span className="tag">{tag}</span>
                  </th>
                  <th scope="col">
                    {label(choice.over)} {what} <span className="tag">{tag}</span>
                  </th>
                  <th scope="col">Spread (bp)</th>
                </tr>
              </thead>
              <tbody>
                {rows
                  .filter((r) => r.point !== null)
                  .map((r) => (
                    <tr key={r.tenor}>
                      <th scope="row">{r.tenor}</th>
                      <td>{formatDate(r.date)}</td>
                      <td>{rate(r.tenor, 'of', r.point!.a)}</td>
                      <td>{rate(r.tenor, 'over', r.point!.b)}</td>
                      <td>
                        {explain.button(cellAt(r.tenor), bpFigure(r.point!.bp), `the spread at ${r.tenor}`, openCell !== null)}
                      </td>
                    </tr>
                  ))}
              </tbody>
            </table>
          </div>
          <OpenExplanation result={result} display={display} cell={openCell} onClose={explain.close} />
          <p className="muted small">
            Spread = {label(choice.of)} minus {label(choice.over)}, each {what} in {tag} from the valuation date{choice.measure === 'forward' ? ` (a forward starts at the maturity and runs ${display.forwardTenor})` : ''}; the compounding and day count are the display's.
            {missing > 0 ? ` ${missing} ${missing === 1 ? 'maturity lies' : 'maturities lie'} past a curve's last pillar and ${missing === 1 ? 'is' : 'are'} not shown.` : ''}
          </p>
        </>
      )}
    </section>
  );
}
