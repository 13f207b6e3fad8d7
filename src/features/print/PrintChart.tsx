import { scaleLinear } from 'd3-scale';
import { formatAxisPercent } from '../../core/index.ts';

/** A plain line chart for the printed page: series of (t, rate) points, straight segments, axes with units. */
export interface PrintSeries {
  readonly label: string;
  readonly colour: string;
  readonly dash?: string;
  /** x: years; y: rate as a decimal. */
  readonly points: readonly { readonly x: number; readonly y: number }[];
}

export interface PrintChartProps {
  readonly title: string;
  /** Compounding and day count of the rates, for example "cont, ACT/365F". */
  readonly tag: string;
  readonly series: readonly PrintSeries[];
  readonly xMax: number;
  /** Time of the last pillar: the stretch after it (extrapolated) is shaded. */
  readonly lastT?: number;
}

/** Decimals that show a tick step (in percent) exactly: 0.25 -> 2, 0.1 -> 1, 1 -> 0 (at most 3). */
function decimalsOf(step: number): number {
  for (let d = 0; d < 3; d++) {
    const scaled = step * 10 ** d;
    if (Math.abs(scaled - Math.round(scaled)) < 1e-6) return d;
  }
  return 3;
}

const W = 340;
const H = 230;
const M = { left: 40, right: 8, top: 26, bottom: 26 };

export function PrintChart({ title, tag, series, xMax, lastT }: PrintChartProps) {
  const ys = series.flatMap((s) => s.points.map((p) => p.y)).filter(Number.isFinite);
  const lo = ys.length ? Math.min(...ys) : 0;
  const hi = ys.length ? Math.max(...ys) : 0.01;
  const pad = Math.max((hi - lo) * 0.08, 0.0005);
  // Rounded tick values (d3's nice steps: 0.1 %, 0.2 %, 0.25 %, ...), the range widened to reach them.
  const yScale = scaleLinear().domain([lo - pad, hi + pad]).range([H - M.bottom, M.top]).nice(5);
  const xScale = scaleLinear().domain([0, xMax || 1]).range([M.left, W - M.right]);
  const sx = (x: number): number => xScale(x);
  const sy = (y: number): number => yScale(y);
  const yTicks = yScale.ticks(5);
  const yDigits = decimalsOf(100 * ((yTicks[1] ?? 1) - (yTicks[0] ?? 0)));
  const xTicks = xScale.ticks(6).filter((x) => x <= xMax);
  const shade = lastT !== undefined && lastT < xMax ? { x: sx(lastT), w: sx(xMax) - sx(lastT) } : null;
  return (
    <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={`${title} (${tag})`}>
      <text x={M.left} y={12} fontSize={10} fontWeight={600}>{title}</text>
      <text x={M.left} y={22} fontSize={8} fill="#5f6671">{tag}; years on the curve's day count{shade ? '; shaded: past the last pillar' : ''}</text>
      {shade && <rect x={shade.x} y={M.top} width={shade.w} height={H - M.top - M.bottom} fill="#f1f2f4" />}
      {yTicks.map((y, i) => (
        <g key={i}>
          <line x1={M.left} x2={W - M.right} y1={sy(y)} y2={sy(y)} stroke="#eceef1" />
          <text x={M.left - 3} y={sy(y) + 3} fontSize={7.5} textAnchor="end">{formatAxisPercent(y, yDigits)}</text>
        </g>
      ))}
      {xTicks.map((x) => (
        <text key={x} x={sx(x)} y={H - M.bottom + 10} fontSize={7.5} textAnchor="middle">{x}</text>
      ))}
      <text x={W - M.right} y={H - 4} fontSize={7.5} textAnchor="end" fill="#5f6671">years</text>
      {series.map((s, i) => (
        <polyline key={i} fill="none" stroke={s.colour} strokeWidth={1.3} strokeDasharray={s.dash} points={s.points.filter((p) => Number.isFinite(p.y)).map((p) => `${sx(p.x).toFixed(1)},${sy(p.y).toFixed(1)}`).join(' ')} />
      ))}
      {series.map((s, i) => (
        <g key={`l${i}`} transform={`translate(${M.left + 6 + (i % 3) * 96}, ${M.top + 8 + Math.floor(i / 3) * 10})`}>
          <line x1={0} x2={12} y1={-3} y2={-3} stroke={s.colour} strokeWidth={1.5} strokeDasharray={s.dash} />
          <text x={15} y={0} fontSize={7.5}>{s.label.slice(0, 22)}</text>
        </g>
      ))}
    </svg>
  );
}
