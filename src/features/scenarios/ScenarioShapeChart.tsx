import { formatNumber, rateTag, type ShapeSample } from '../../core/index.ts';
import { useChartWidth } from '../../charts/useChartWidth.ts';

export interface ScenarioShapeChartProps {
  readonly name: string;
  readonly samples: readonly ShapeSample[];
  /** Nodes of the shape (maturity label, t, bp) and zero marks such as the pivot. */
  readonly nodes: readonly { readonly label: string; readonly t: number; readonly bp: number }[];
  /** What the shift moves, for the caption: "zero rates (cont, ACT/365F)" or "each quote in its own convention". */
  readonly moves: string;
  /** The curve's day count (the time axis and the forward's clock). */
  readonly dayCount: string;
}

/** Drawing width before the box is measured; then the box's width, so the 10 px text is never scaled down. */
const W0 = 260;
const H = 130;
const M = { left: 34, right: 10, top: 8, bottom: 26 };
const FONT = 10;

/** A scenario's shape Delta(t) (solid) beside the change it makes to the instantaneous forward (dashed), both in bp. */
export function ScenarioShapeChart({ name, samples, nodes, moves, dayCount }: ScenarioShapeChartProps) {
  const [boxRef, measured] = useChartWidth<HTMLElement>(W0);
  const W = Math.min(measured, 420);
  const xs = samples.map((s) => s.t);
  const xMax = Math.max(1, ...xs);
  const vals = samples.flatMap((s) => [s.shiftBp, s.forwardBp]).filter(Number.isFinite);
  const lo = Math.min(0, ...vals);
  const hi = Math.max(0, ...vals);
  const span = hi - lo || 1;
  const sx = (t: number): number => M.left + ((W - M.left - M.right) * t) / xMax;
  const sy = (v: number): number => H - M.bottom - ((H - M.top - M.bottom) * (v - lo)) / span;
  const path = (f: (s: ShapeSample) => number): string =>
    samples.filter((s) => Number.isFinite(f(s))).map((s) => `${sx(s.t).toFixed(1)},${sy(f(s)).toFixed(1)}`).join(' ');
  return (
    <figure className="scenario-shape" ref={boxRef}>
      <svg viewBox={`0 0 ${W} ${H}`} width={W} height={H} role="img" aria-label={`${name}: shift in bp by maturity (solid) and change of the instantaneous forward in bp (dashed)`}>
        <line x1={M.left} x2={W - M.right} y1={sy(0)} y2={sy(0)} stroke="#d9dde3" />
        <text x={M.left - 3} y={sy(hi) + 3} fontSize={FONT} textAnchor="end">{formatNumber(hi, 0)}</text>
        <text x={M.left - 3} y={sy(lo) + 3} fontSize={FONT} textAnchor="end">{formatNumber(lo, 0)}</text>
        <text x={M.left - 3} y={sy(0) + 3} fontSize={FONT} textAnchor="end">0</text>
        <text x={W - M.right} y={M.top + 2} fontSize={FONT} textAnchor="end" fill="#5f6671">bp</text>
        {[0, 5, 10, 20, 30, 40, 50].filter((x) => x <= xMax).map((x) => (
          <text key={`x${x}`} x={sx(x)} y={H - 1} fontSize={FONT} textAnchor="middle" fill="#5f6671">{x}y</text>
        ))}
        <polyline fill="none" stroke="#8a5a00" strokeDasharray="3 2" strokeWidth={1} points={path((s) => s.forwardBp)} />
        <polyline fill="none" stroke="#1d5fa6" strokeWidth={1.6} points={path((s) => s.shiftBp)} />
        {nodes.filter((n) => n.t <= xMax).map((n, i) => (
          <g key={i}>
            <circle cx={sx(n.t)} cy={sy(n.bp)} r={2.4} fill="#1d5fa6" />
            <text x={sx(n.t)} y={H - M.bottom + 12} fontSize={FONT} textAnchor="middle">{n.label}</text>
          </g>
        ))}
      </svg>
      <figcaption className="small muted">
        Solid: shift, bp, of {moves}. Dashed: change of the instantaneous forward, bp ({rateTag('continuous', dayCount)}). Years on {dayCount}.
      </figcaption>
    </figure>
  );
}
