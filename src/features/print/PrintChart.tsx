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
}

const W = 340;
const H = 230;
const M = { left: 40, right: 8, top: 26, bottom: 26 };

export function PrintChart({ title, tag, series, xMax }: PrintChartProps) {
  const ys = series.flatMap((s) => s.points.map((p) => p.y)).filter(Number.isFinite);
  const lo = ys.length ? Math.min(...ys) : 0;
  const hi = ys.length ? Math.max(...ys) : 0.01;
  const pad = Math.max((hi - lo) * 0.08, 0.0005);
  const y0 = lo - pad;
  const y1 = hi + pad;
  const sx = (x: number): number => M.left + ((W - M.left - M.right) * x) / (xMax || 1);
  const sy = (y: number): number => H - M.bottom - ((H - M.top - M.bottom) * (y - y0)) / (y1 - y0 || 1);
  const yTicks = Array.from({ length: 5 }, (_, i) => y0 + ((y1 - y0) * i) / 4);
  const xTicks = [0, 5, 10, 15, 20, 25, 30, 40, 50].filter((x) => x <= xMax);
  return (
    <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={`${title} (${tag})`}>
      <text x={M.left} y={12} fontSize={10} fontWeight={600}>{title}</text>
      <text x={M.left} y={22} fontSize={8} fill="#5f6671">{tag}; years on the curve's day count</text>
      {yTicks.map((y, i) => (
        <g key={i}>
          <line x1={M.left} x2={W - M.right} y1={sy(y)} y2={sy(y)} stroke="#eceef1" />
          <text x={M.left - 3} y={sy(y) + 3} fontSize={7.5} textAnchor="end">{(100 * y).toFixed(2)}%</text>
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
