import { useMemo } from 'react';
import { forwardStrip, parseTenor, type Curve, formatNumber, formatPercent, rateTag } from '../../core/index.ts';
import { useAppStore } from '../../state/store.ts';

/** Consecutive forwards of the chosen tenor from settlement to the last pillar. */
export function ForwardStripTable({ curve }: { curve: Curve }) {
  const display = useAppStore((s) => s.workspace.display);
  const horizon = curve.pillars[curve.pillars.length - 1]?.date ?? curve.settlement;
  const strip = useMemo(() => forwardStrip(curve, parseTenor(display.forwardTenor)!, horizon, display.compounding, display.dayCount), [curve, display, horizon]);
  const tag = rateTag(display.compounding, display.dayCount);
  if (!strip.ok) return <p className="field-error">{strip.errors[0]?.message}</p>;
  return (
    <div className="scroll-y" tabIndex={0} role="region" aria-label="Forward strip (scrolls)">
      <table className="data" aria-label="Forward strip">
        <caption>
          {display.forwardTenor} forward strip to {horizon} ({strip.value.length} periods) <span className="tag">{tag}</span>
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
              <td className="n">{formatPercent(f.rate)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
