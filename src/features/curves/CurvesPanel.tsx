import { useMemo, useRef, useState } from 'react';
import { INTERPOLATORS, couponTag, rateTag, type InterpolationId } from '../../core/index.ts';
import { RateChart, type ChartLine } from '../../charts/RateChart.tsx';
import { BASE_STYLES, METHOD_STYLES, SCENARIO_OVERLAY_MAX } from '../../charts/palette.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useCurveSeries } from '../../hooks/useCurveSeries.ts';
import { useMethodOverlay } from '../../hooks/useMethodOverlay.ts';
import { useScenarioOverlay } from '../scenarios/useScenarioOverlay.ts';
import { ComparisonControls } from '../compare/ComparisonControls.tsx';
import { useComparisonOverlay } from '../compare/useComparisonOverlay.ts';
import { useAppStore } from '../../state/store.ts';
import type { SamplePoint } from '../../hooks/useCurveSeries.ts';
import type { DatedCell, ExplainCell } from '../tables/explainCell.ts';
import { OpenExplanation } from '../tables/explainOpener.tsx';
import { datedAt } from './datedAt.ts';

const ZERO = datedAt('zero');
const FORWARD = datedAt('forward');
const PAR = datedAt('par');
const INST = datedAt('inst');
/** The method overlay's forwards, one factory per method (kept, so the memoised charts keep them). */
const BY_METHOD: Partial<Record<InterpolationId, (p: SamplePoint) => DatedCell>> = {};

/** The zero and forward charts side by side on a shared maturity axis. */
export function CurvesPanel({ result, deferredResult = result }: { result: WorkbenchBuild; deferredResult?: WorkbenchBuild }) {
  const display = useAppStore((s) => s.workspace.display);
  const curve = result.build.curve;
  const series = useCurveSeries(curve, display, result.build.repricing);
  const overlay = useMethodOverlay(curve ? result.conversion.doc : null, display, display.showMethodOverlay);
  // The document's scenarios drawn over the base curve (scenarios feature), from the deferred build.
  const scenarioLines = useScenarioOverlay(deferredResult);
  // Snapshots, the reference curve and the smooth fit chosen in the view (compare feature), from the deferred build.
  const comparisons = useComparisonOverlay(deferredResult);
  // The point of a chart line whose number is explained (its line's `explain`), and the button that opened it.
  const [explained, setExplained] = useState<ExplainCell | null>(null);
  const opener = useRef<HTMLElement | null>(null);
  const explainAs = (words: string) => ({
    words,
    open: (cell: unknown, button: HTMLElement) => {
      opener.current = button;
      setExplained(cell as ExplainCell);
    },
  });
  // Kept across renders, so the memoised charts do not draw again for them.
  const explainZero = useMemo(() => explainAs('zero rate'), []);
  const explainForward = useMemo(() => explainAs(`${display.forwardTenor} forward`), [display.forwardTenor]);
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
  const zeroLines: ChartLine[] = [{ id: 'zero', label: 'Zero', tag, ...BASE_STYLES.zero, points: series.zero, explain: ZERO }];
  if (display.showPar) zeroLines.push({ id: 'par', label: 'Par yield', tag: couponTag(display.parFrequency, 'ACT/ACT-ICMA'), ...BASE_STYLES.par, points: series.par, explain: PAR });
  const fwdLabel = `${display.forwardTenor} forward`;
  const fwdLines: ChartLine[] = [];
  if (display.showMethodOverlay) {
    for (const m of overlay) {
      if (m.method === curve.interpolation) continue;
      fwdLines.push({ id: `m-${m.method}`, label: INTERPOLATORS[m.method].label, tag, ...METHOD_STYLES[m.method]!, points: m.points, explain: (BY_METHOD[m.method] ??= datedAt('forward', { method: m.method })) });
    }
  }
  fwdLines.unshift({ id: 'forward', label: display.showMethodOverlay ? `${fwdLabel} (${INTERPOLATORS[curve.interpolation].label})` : fwdLabel, tag, ...BASE_STYLES.forward, points: series.forward, explain: FORWARD });
  if (display.showInstantaneous) fwdLines.push({ id: 'inst', label: 'Instantaneous', tag: `${rateTag('continuous', curve.dayCount)} from settlement`, ...BASE_STYLES.instantaneous, points: series.instantaneous, explain: INST });
  zeroLines.push(...scenarioLines.zero);
  fwdLines.push(...scenarioLines.forward);
  zeroLines.push(...comparisons.zero);
  fwdLines.push(...comparisons.forward);
  const scenarioNote = scenarioOverlayNote(scenarioLines.notDrawn, scenarioLines.failed);
  const compareNote = comparisons.notes.length > 0 ? comparisons.notes.join('; ') : null;
  const pending = display.showMethodOverlay ? 5 - overlay.length : 0;
  const markers = display.showPar ? series.markers.map((m) => ({ x: m.x, y: m.y, label: `Quote row ${(result.conversion.rowOfQuote[m.quote] ?? 0) + 1}: ${m.kind} ${m.date}` })) : [];
  return (
    <section className="panel charts-panel" aria-label="Charts">
      <ComparisonControls drawn={comparisons.zero.length} />
      <div className="charts">
        <div className="chart-box">
          <h3>
            Zero curve <span className="tag">{tag}</span>
          </h3>
          <Legend lines={zeroLines} extra={display.showPar ? 'quotes on the par line' : null} note={scenarioNote} compareNote={compareNote} how={comparisons.how.zero} />
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
            explain={explainZero}
          />
          <div className="chart-notes" />
        </div>
        <div className="chart-box">
          <h3>
            Forward curve <span className="tag">{tag}</span>
          </h3>
          <Legend lines={fwdLines} extra="ticks mark pillar dates" note={scenarioNote} compareNote={compareNote} how={comparisons.how.forward} />
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
            explain={explainForward}
          />
          <div className="chart-notes">
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
      </div>
      <OpenExplanation
        result={result}
        display={display}
        cell={explained}
        onClose={() => {
          setExplained(null);
          opener.current?.focus();
        }}
      />
    </section>
  );
}

/** "2 more scenarios not drawn" when the charts' cap is reached, and the scenarios that could not be built. */
export function scenarioOverlayNote(notDrawn: number, failed: readonly string[]): string | null {
  const parts: string[] = [];
  if (notDrawn > 0) parts.push(`${notDrawn} more scenario${notDrawn === 1 ? '' : 's'} not drawn (the charts show the first ${SCENARIO_OVERLAY_MAX}; all are in the Scenarios section)`);
  if (failed.length > 0) parts.push(`not drawn, could not be built: ${failed.join(', ')} (see the Scenarios section)`);
  return parts.length ? parts.join('; ') : null;
}

function Legend({ lines, extra, note, compareNote, how = [] }: { lines: readonly ChartLine[]; extra: string | null; note: string | null; compareNote: string | null; how?: readonly string[] }) {
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
      {how.map((h) => (
        <li key={h} className="muted legend-how">
          {h}
        </li>
      ))}
      {extra && <li className="muted">{extra}; dashed past the last pillar</li>}
      {note && <li className="legend-note" data-testid="scenarios-not-drawn">{note}</li>}
      {compareNote && <li className="legend-note" data-testid="comparisons-not-drawn">{compareNote}</li>}
    </ul>
  );
}
