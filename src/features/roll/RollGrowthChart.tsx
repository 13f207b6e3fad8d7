import { scaleLinear } from 'd3-scale';
import { curveLinear, curveStepAfter, line } from 'd3-shape';
import { useId } from 'react';
import { figure, type GrowthSeries, type StrategyDescription, type StrategyId } from '../../core/index.ts';
import { useChartWidth } from '../../charts/useChartWidth.ts';

/** Colours and dashes per strategy: told apart by dash as well as colour, so they survive a grey print. */
export const ROLL_STYLE: Readonly<Record<StrategyId, { colour: string; dash: string; width: number }>> = {
  roll: { colour: '#1d5fa6', dash: '', width: 2.2 },
  zero: { colour: '#5b6470', dash: '6 3', width: 1.6 },
  bond: { colour: '#187a5e', dash: '2 2', width: 1.8 },
  riding: { colour: '#a0521c', dash: '8 3 2 3', width: 1.8 },
};

/** Drawing width before the box is measured; then the box's own width, so the text keeps its 10 px. */
const W0 = 560;
const H = 230;
const M = { top: 10, right: 14, bottom: 34, left: 78 };
/** Money on the axis and in the description: whole units, thousands grouped. */
const moneyTick = (v: number): string => figure(v, 0, { group: true });

export interface RollGrowthChartProps {
  /** The unit shown with money (the currency code or the generic sign). */
  readonly unit: string;
  readonly series: readonly GrowthSeries[];
  readonly strategies: readonly StrategyDescription[];
  readonly viewLabel: string;
  readonly horizon: string;
}

/**
 * The amount over time under the chosen view: rolling as steps (interest credited at each leg
 * end), the term strategies as lines at their constant annualised return (only their end points
 * are values; the line shows the pace). Drawn with d3-scale and d3-shape, rendered by React.
 */
export function RollGrowthChart({ unit, series, strategies, viewLabel, horizon }: RollGrowthChartProps) {
  const id = useId();
  const [boxRef, W] = useChartWidth<HTMLElement>(W0);
  const all = series.flatMap((s) => s.points);
  const xMax = Math.max(...all.map((p) => p.t), 1e-6);
  const yMin = Math.min(...all.map((p) => p.value));
  const yMax = Math.max(...all.map((p) => p.value));
  const pad = (yMax - yMin) * 0.06 || Math.abs(yMax) * 0.001 || 1;
  const x = scaleLinear().domain([0, xMax]).range([M.left, W - M.right]);
  const y = scaleLinear().domain([yMin - pad, yMax + pad]).range([H - M.bottom, M.top]).nice(5);
  const label = (sid: StrategyId): string => strategies.find((s) => s.id === sid)?.label ?? sid;
  const finals = series.map((s) => `${label(s.id)} ${moneyTick(s.points[s.points.length - 1]?.value ?? 0)}`).join('; ');
  return (
    <figure className="roll-chart" ref={boxRef}>
      <svg viewBox={`0 0 ${W} ${H}`} width={W} height={H} role="img" aria-labelledby={`${id}-t ${id}-d`} preserveAspectRatio="xMidYMid meet">
        <title id={`${id}-t`}>{`Growth of the amount to ${horizon} under ${viewLabel}`}</title>
        <desc id={`${id}-d`}>{`Value in ${unit} against years from settlement (ACT/365F). At the horizon: ${finals}.`}</desc>
        <g className="roll-grid">
          {y.ticks(5).map((v) => (
            <g key={v}>
              <line x1={M.left} x2={W - M.right} y1={y(v)} y2={y(v)} />
              <text x={M.left - 6} y={y(v)} dy="0.32em" textAnchor="end">
                {moneyTick(v)}
              </text>
            </g>
          ))}
          {x.ticks(Math.min(8, Math.max(2, Math.ceil(xMax * 2)), Math.floor((W - M.left - M.right) / 50))).map((v) => (
            <g key={v}>
              <line x1={x(v)} x2={x(v)} y1={M.top} y2={H - M.bottom} />
              <text x={x(v)} y={H - M.bottom + 14} textAnchor="middle">
                {v}
              </text>
            </g>
          ))}
        </g>
        <text className="roll-axis-label" x={(M.left + W - M.right) / 2} y={H - 4} textAnchor="middle">
          Years from settlement (ACT/365F)
        </text>
        <text className="roll-axis-label" transform={`translate(12 ${(M.top + H - M.bottom) / 2}) rotate(-90)`} textAnchor="middle">
          {`Value (${unit})`}
        </text>
        {series.map((s) => {
          const st = ROLL_STYLE[s.id];
          const d = line<{ t: number; value: number }>()
            .x((p) => x(p.t))
            .y((p) => y(p.value))
            .curve(s.shape === 'steps' ? curveStepAfter : curveLinear)([...s.points]);
          return <path key={s.id} data-strategy={s.id} d={d ?? ''} fill="none" stroke={st.colour} strokeWidth={st.width} strokeDasharray={st.dash || undefined} />;
        })}
      </svg>
      <figcaption>
        <ul className="roll-legend">
          {strategies.map((s) => (
            <li key={s.id}>
              <svg width="26" height="10" aria-hidden="true">
                <line x1="1" x2="25" y1="5" y2="5" stroke={ROLL_STYLE[s.id].colour} strokeWidth={ROLL_STYLE[s.id].width} strokeDasharray={ROLL_STYLE[s.id].dash || undefined} />
              </svg>
              {s.label}
              {s.id === 'roll' ? ' (steps at each leg end)' : ''}
            </li>
          ))}
        </ul>
        <span className="muted small">Term strategies are drawn at their constant annualised return; only the start and the horizon value are computed values.</span>
      </figcaption>
    </figure>
  );
}
