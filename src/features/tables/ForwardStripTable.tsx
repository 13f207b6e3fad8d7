import { useMemo } from 'react';
import { forwardStrip, parseTenor, type Curve, formatNumber, formatPercent, rateTag } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import type { DatedCell } from './explainCell.ts';
import { OpenExplanation, useExplainOpener } from './explainOpener.tsx';

/** Consecutive forwards of the chosen tenor from settlement to the last pillar; with the build, each forward opens its explanation. */
export function ForwardStripTable({ curve, result }: { curve: Curve; result?: WorkbenchBuild }) {
  const display = useAppStore((s) => s.workspace.display);
  const horizon = curve.pillars[curve.pillars.length - 1]?.date ?? curve.settlement;
  const strip = useMemo(() => forwardStrip(curve, parseTenor(display.forwardTenor)!, horizon, display.compounding, display.dayCount), [curve, display, horizon]);
  const tag = rateTag(display.compounding, display.dayCount);
  const explain = useExplainOpener<DatedCell>((a, b) => a.start === b.start && a.end === b.end);
  if (!strip.ok) return <p className="field-error">{strip.errors[0]?.message}</p>;
  const table = (
    <div className="scroll-y" tabIndex={0} role="region" aria-label="Forward strip (scrolls)">
      <table className="data" aria-label="Forward strip">
        <caption>
          {display.forwardTenor} forward strip to {horizon} ({strip.value.length} periods) <span className="tag">{tag}</span>
          {result ? <span className="muted">. Choose a forward to see how it is made.</span> : null}
        </caption>
        <thead>
          <tr>
            <th scope="col">#</th>
            <th scope="col">Start</th>
            <th scope="col">End</th>
            <th scope="col">Year fraction ({display.dayCount})</th>
            <th scope="col">
              Forward <span className="tag">{tag}</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {strip.value.map((f, i) => (
            <tr key={f.start}>
              <td className="n">{i + 1}</td>
              <td>{f.start}</td>
              <td>{f.end}</td>
              <td className="n">{formatNumber(f.tau, 6)}</td>
              <td className="n" data-field="forward">
                {result ? (
                  explain.button({ field: 'forward', start: f.start, end: f.end, title: `${display.forwardTenor} forward rate, period ${i + 1} of the strip (${f.start} to ${f.end})` }, formatPercent(f.rate), `the forward rate of period ${i + 1} (${f.start} to ${f.end})`)
                ) : (
                  formatPercent(f.rate)
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
  if (!result) return table;
  return (
    <div className="key-maturities">
      {table}
      <OpenExplanation result={result} display={display} cell={explain.open} onClose={explain.close} />
    </div>
  );
}
