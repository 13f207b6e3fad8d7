import { INTERPOLATORS } from '../../core/index.ts';
import { RateChart, type ChartLine } from '../../charts/RateChart.tsx';
import { METHOD_COLOURS, METHOD_DASH, PALETTE } from '../../charts/palette.ts';
import { couponTag, rateTag } from '../../components/format.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useCurveSeries } from '../../hooks/useCurveSeries.ts';
import { useMethodOverlay } from '../../hooks/useMethodOverlay.ts';
import { useScenarioOverlay } from '../scenarios/useScenarioOverlay.ts';
import { useAppStore } from '../../state/store.ts';

/** The zero and forward charts side by side on a shared maturity axis. */
export function CurvesPanel({ result, deferredResult = result }: { result: WorkbenchBuild; deferredResult?: WorkbenchBuild }) {
  const display = useAppStore((s) => s.workspace.display);
  const curve = result.build.curve;
  const series = useCurveSeries(curve, display, result.build.repricing);
  const overlay = useMethodOverlay(curve ? result.conversion.doc : null, display, display.showMethodOverlay);
  // The document's scenarios drawn over the base curve (scenarios feature), from the deferred build.
  const scenarioLines = useScenarioOverlay(deferredResult);
  if (!curve || !series) {
    return (
      <section className="panel charts-panel" aria-label="Charts">
        <p className="empty" role="alert">
          No curve to draw: {result.fatal}
        </p>
      </section>
    );
  }
  const tag = rateTag(display.compounding, display.dayCount);
  const xLabel = `Maturity (years from settlement, ${curve.dayCount}${display.axis === 'sqrt' ? ', square-root spaced' : ''})`;
  const zeroLines: ChartLine[] = [{ id: 'zero', label: 'Zero', tag, colour: PALETTE.zero, points: series.zero }];
  if (display.showPar) zeroLines.push({ id: 'par', label: 'Par yield', tag: couponTag(display.parFrequency, 'ACT/ACT-ICMA'), colour: PALETTE.par, dash: '7 3', points: series.par });
  const fwdLabel = `${display.forwardTenor} forward`;
  const fwdLines: ChartLine[] = [];
  if (display.showMethodOverlay) {
    for (const m of overlay) {
      if (m.method === curve.interpolation) continue;
      fwdLines.push({ id: `m-${m.method}`, label: INTERPOLATORS[m.method].label, tag, colour: METHOD_COLOURS[m.method] ?? '#777', dash: METHOD_DASH[m.method] || '5 3', width: 1.4, points: m.points });
    }
  }
  fwdLines.unshift({ id: 'forward', label: display.showMethodOverlay ? `${fwdLabel} (${INTERPOLATORS[curve.interpolation].label})` : fwdLabel, tag, colour: PALETTE.forward, points: series.forward, width: 2.2 });
  if (display.showInstantaneous) fwdLines.push({ id: 'inst', label: 'Instantaneous', tag: `cont, ${curve.dayCount} (curve clock)`, colour: PALETTE.instantaneous, dash: '2 2', width: 1.5, points: series.instantaneous });
  zeroLines.push(...scenarioLines.zero);
  fwdLines.push(...scenarioLines.forward);
  const pending = display.showMethodOverlay ? 5 - overlay.length : 0;
  const markers = display.showPar ? series.markers.map((m) => ({ x: m.x, y: m.y, label: `Quote row ${(result.conversion.rowOfQuote[m.quote] ?? 0) + 1}: ${m.kind} ${m.date}` })) : [];
  return (
    <section className="panel charts-panel" aria-label="Charts">
      <div className="charts">
        <div className="chart-box">
          <h3>
            Zero curve <span className="tag">{tag}</span>
          </h3>
          <Legend lines={zeroLines} extra={display.showPar ? 'quotes on the par line' : null} />
          <RateChart
            name={`Zero curve, ${tag}`}
            description={`Zero rates${display.showPar ? ' and par yields' : ''} against maturity, ${curve.interpolation} interpolation.`}
            lines={zeroLines}
            markers={markers}
            xMax={series.xMax}
            lastT={series.lastT}
            axis={display.axis}
            xLabel={xLabel}
            yLabel={`Rate (%, ${tag})`}
          />
        </div>
        <div className="chart-box">
          <h3>
            Forward curve <span className="tag">{tag}</span>
          </h3>
          <Legend lines={fwdLines} extra="ticks mark pillar dates" />
          <RateChart
            name={`Forward curve, ${display.forwardTenor} forwards, ${tag}`}
            description={`${display.forwardTenor} forward rates by start date${display.showInstantaneous ? ', with instantaneous forwards' : ''}${display.showMethodOverlay ? ', with every interpolation method overlaid' : ''}.`}
            lines={fwdLines}
            pillars={series.pillars}
            xMax={series.xMax}
            lastT={series.lastT}
            axis={display.axis}
            xLabel={`Forward start (years from settlement, ${curve.dayCount})`}
            yLabel={`Forward rate (%, ${tag})`}
          />
          {pending > 0 && <p className="muted small">Building the other methods… ({overlay.length} of 5)</p>}
          {overlay
            .filter((m) => m.error)
            .map((m) => (
              <p key={m.method} className="muted small">
                {INTERPOLATORS[m.method].label}: {m.error}
              </p>
            ))}
        </div>
      </div>
    </section>
  );
}

function Legend({ lines, extra }: { lines: readonly ChartLine[]; extra: string | null }) {
  return (
    <ul className="legend">
      {lines.map((l) => (
        <li key={l.id}>
          <svg width="22" height="8" aria-hidden="true">
            <line x1="1" x2="21" y1="4" y2="4" stroke={l.colour} strokeWidth={2} strokeDasharray={l.dash} />
          </svg>
          {l.label} <span className="tag">{l.tag}</span>
        </li>
      ))}
      {extra && <li className="muted">{extra}; dashed past the last pillar</li>}
    </ul>
  );
}
