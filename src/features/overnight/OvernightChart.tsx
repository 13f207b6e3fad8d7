import { useId, useMemo } from 'react';
import { scaleLinear } from 'd3-scale';
import { curveStepAfter, line } from 'd3-shape';
import { formatAxisPercent, formatBp, formatPercent, OVERNIGHT_CONVENTION, rateTag, type OvernightView } from '../../core/index.ts';
import { CHART_FONT_PX } from '../../charts/RateChart.tsx';
import { PALETTE } from '../../charts/palette.ts';
import { ChartAxes } from '../../charts/ChartAxes.tsx';
import { useChartWidth } from '../../charts/useChartWidth.ts';

const W0 = 640;
const M = { left: 54, right: 14, top: 14, bottom: 42 };
const heightFor = (w: number): number => Math.round(Math.min(340, Math.max(220, w * 0.45)));
/** The turns' shading and the meeting marks (not series: a light band and thin dashed rules). */
const TURN_FILL = '#f3e3d3';
const MEETING_RULE = '#6b5f8a';
type Point = OvernightView['points'][number];

/**
 * The one-day forward curve drawn as steps (each day's rate held to the next day: curveStepAfter,
 * never smoothed), with each meeting's effective date as a dashed rule and each turn as a shaded
 * band. Every value comes from the core's overnightForwardView.
 */
export function OvernightChart({ view }: { view: OvernightView }) {
  const descId = useId();
  const [boxRef, W, measured] = useChartWidth<HTMLElement>(W0);
  const H = heightFor(W);
  const x = useMemo(() => scaleLinear().domain([0, Math.max(view.endT, 1 / 365)]).range([M.left, W - M.right]), [view.endT, W]);
  const y = useMemo(() => {
    let lo = Infinity;
    let hi = -Infinity;
    for (const p of view.points) if (Number.isFinite(p.rate)) ((lo = Math.min(lo, p.rate)), (hi = Math.max(hi, p.rate)));
    if (!Number.isFinite(lo)) ((lo = 0), (hi = 0.05));
    const pad = Math.max((hi - lo) * 0.08, 0.0005);
    return scaleLinear().domain([lo - pad, hi + pad]).range([H - M.bottom, M.top]).nice(6);
  }, [view.points, H]);
  const path = useMemo(() => {
    // The last day's rate runs to the range's end: one more point at the end repeats it.
    const last = view.points[view.points.length - 1];
    const pts: { t: number; rate: number }[] = last ? [...view.points, { t: view.endT, rate: last.rate }] : [];
    return (
      line<{ t: number; rate: number }>()
        .x((p) => x(p.t))
        .y((p) => y(p.rate))
        .defined((p) => Number.isFinite(p.rate))
        .curve(curveStepAfter)
        .digits(2)(pts) ?? ''
    );
  }, [view, x, y]);
  const tag = rateTag(OVERNIGHT_CONVENTION.compounding, OVERNIGHT_CONVENTION.dayCount);
  const xTicks = x.ticks(Math.max(2, Math.min(6, Math.floor(W / 110))));
  const yTicks = y.ticks(5);
  const first: Point | undefined = view.points[0];
  return (
    <figure className="chart overnight-chart" ref={boxRef}>
      <svg role="img" aria-label={`Overnight forward, one-day rates (${tag})`} aria-describedby={descId} viewBox={`0 0 ${W} ${H}`} width={W} height={H}>
        {measured && (
          <>
            <g className="grid">
              {yTicks.map((v) => (
                <line key={`gy${v}`} x1={M.left} x2={W - M.right} y1={y(v)} y2={y(v)} stroke={PALETTE.grid} />
              ))}
            </g>
            {view.turns.map((s) => (
              <rect key={`turn-${s.name}`} data-turn={s.name} x={x(s.a)} y={M.top} width={Math.max(1.5, x(Math.min(s.b, view.endT)) - x(s.a))} height={H - M.top - M.bottom} fill={TURN_FILL}>
                <title>{`Turn “${s.name}”: ${s.start} to ${s.end} (${formatBp(s.spreadBp)} on each day's overnight rate, ${tag})`}</title>
              </rect>
            ))}
            {view.meetings.map((m) => (
              <line key={`m${m.date}`} data-meeting={m.date} x1={x(m.t)} x2={x(m.t)} y1={M.top} y2={H - M.bottom} stroke={MEETING_RULE} strokeDasharray="4 3" strokeWidth={1}>
                <title>{`Effective date ${m.date}`}</title>
              </line>
            ))}
            <ChartAxes
              w={W}
              h={H}
              m={M}
              x={x}
              y={y}
              xTicks={xTicks}
              yTicks={yTicks}
              yTickText={(v) => formatAxisPercent(v, 2, 1)}
              xLabel={<>Years from the valuation date (to {view.end})</>}
              yLabel={<>One-day forward ({tag})</>}
              fontPx={CHART_FONT_PX}
            />
            <path d={path} fill="none" stroke={PALETTE.forward} strokeWidth={1.8} data-series="overnight" />
          </>
        )}
      </svg>
      <figcaption id={descId} className="chart-caption small muted">
        One-day forward rates ({tag}) for each day from {first?.date ?? '—'} to {view.end}, drawn as steps
        {view.meetings.length > 0 ? `; dashed rules: ${view.meetings.length} effective ${view.meetings.length === 1 ? 'date' : 'dates'}` : ''}
        {view.turns.length > 0 ? `; shaded: ${view.turns.map((s) => `${s.name} (${s.start} to ${s.end})`).join(', ')}` : ''}.
        {first ? ` First day: ${formatPercent(first.rate)}.` : ''}
      </figcaption>
    </figure>
  );
}
