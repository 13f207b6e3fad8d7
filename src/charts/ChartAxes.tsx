import type { ReactNode } from 'react';
import { PALETTE } from './palette.ts';

/** A chart's margins inside its width and height, in px. */
export interface ChartMargins {
  readonly left: number;
  readonly right: number;
  readonly top: number;
  readonly bottom: number;
}

/**
 * The two axes of a chart drawn on the house grid: the lines, the x ticks as given, the y ticks
 * through `yTickText`, and the axis labels (each label names its unit, and a rate's label its
 * compounding and day count). `x` and `y` map values to px.
 */
export function ChartAxes(props: {
  readonly w: number;
  readonly h: number;
  readonly m: ChartMargins;
  readonly x: (v: number) => number;
  readonly y: (v: number) => number;
  readonly xTicks: readonly number[];
  readonly yTicks: readonly number[];
  readonly yTickText: (v: number) => string;
  readonly xLabel: ReactNode;
  readonly yLabel: ReactNode;
  readonly fontPx: number;
}) {
  const { w: W, h: H, m: M, x, y } = props;
  return (
    <g className="axis" fontSize={props.fontPx} fill={PALETTE.axis}>
      <line x1={M.left} x2={W - M.right} y1={H - M.bottom} y2={H - M.bottom} stroke={PALETTE.axis} />
      <line x1={M.left} x2={M.left} y1={M.top} y2={H - M.bottom} stroke={PALETTE.axis} />
      {props.xTicks.map((v) => (
        <text key={`tx${v}`} x={x(v)} y={H - M.bottom + 15} textAnchor="middle">
          {v}
        </text>
      ))}
      {props.yTicks.map((v) => (
        <text key={`ty${v}`} x={M.left - 6} y={y(v) + 4} textAnchor="end">
          {props.yTickText(v)}
        </text>
      ))}
      <text x={(M.left + W - M.right) / 2} y={H - 6} textAnchor="middle">
        {props.xLabel}
      </text>
      <text transform={`translate(13 ${(M.top + H - M.bottom) / 2}) rotate(-90)`} textAnchor="middle">
        {props.yLabel}
      </text>
    </g>
  );
}
