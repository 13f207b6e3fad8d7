import { memo, useId, useMemo, useState, type KeyboardEvent, type PointerEvent } from 'react';
import { scaleLinear } from 'd3-scale';
import { curveLinear, line } from 'd3-shape';
import { bpFigure, formatAxisPercent, formatBp, formatNumber, formatPercent, type MaturityAxis } from '../core/index.ts';
import type { SamplePoint } from '../hooks/useCurveSeries.ts';
import { hoverStore, useHoverX } from './hover.ts';
import { maturityScale, maturityTicks } from './maturityScale.ts';
import { PALETTE } from './palette.ts';
import { ChartAxes } from './ChartAxes.tsx';
import { useChartWidth } from './useChartWidth.ts';

export interface ChartLine {
  readonly id: string;
  readonly label: string;
  /** Compounding and day count of the line's rates, e.g. "cont, ACT/365F". */
  readonly tag: string;
  readonly colour: string;
  readonly dash?: string;
  readonly width?: number;
  readonly points: readonly SamplePoint[];
  /** What explains the line's point (handed to the chart's `explain.open`); kept across renders, as the chart is memoised. */
  readonly explain?: (p: SamplePoint) => unknown;
}

export interface ChartMarker {
  readonly x: number;
  readonly y: number;
  readonly label: string;
}

export interface RateChartProps {
  /** Accessible name, e.g. "Zero curve". */
  readonly name: string;
  readonly description: string;
  readonly lines: readonly ChartLine[];
  readonly markers?: readonly ChartMarker[];
  readonly pillars?: readonly { readonly x: number; readonly date: string }[];
  readonly xMax: number;
  readonly lastT: number;
  readonly axis: MaturityAxis;
  readonly xLabel: string;
  readonly yLabel: string;
  /**
   * With it, a row under the readout has a button per line with an `explain`, which opens the
   * explanation of that line's point at the maturity last read; `words` names the first line's number ("zero rate").
   */
  readonly explain?: { readonly words: string; readonly open: (cell: unknown, button: HTMLElement) => void };
  /** The lines' y values are basis points (a spread), not decimal rates: the axis and the readout say bp. */
  readonly bp?: boolean;
}

/** No pillar ticks (one list, so PillarTicks stays memoised). */
const NO_PILLARS: NonNullable<RateChartProps['pillars']> = [];

/** Drawing width before the chart's box is measured (user units = CSS pixels once measured). */
const W0 = 540;
/** Height for a drawing width: about 0.7 of it, between 240 and 400 px, so the plot scales and the text does not. */
const heightFor = (w: number): number => Math.round(Math.min(400, Math.max(240, w * 0.7)));
const M = { left: 54, right: 14, top: 14, bottom: 42 };
/** Chart text size in CSS pixels (axis ticks and labels); never scaled, since the drawing is the box's size. */
export const CHART_FONT_PX = 11;

const yTickText = (v: number): string => formatAxisPercent(v, 2, 1);

/** Index of the sample nearest x (points sorted by x). */
export function nearestIndex(points: readonly SamplePoint[], x: number): number {
  let lo = 0;
  let hi = points.length - 1;
  if (hi < 0) return -1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (points[mid]!.x < x) lo = mid + 1;
    else hi = mid;
  }
  if (lo > 0 && Math.abs(points[lo - 1]!.x - x) <= Math.abs(points[lo]!.x - x)) return lo - 1;
  return lo;
}

/**
 * A rate chart: the core's curve sampled on a fine grid, joined by straight segments
 * (curveLinear; never a display smoothing), drawn by React from d3-scale and d3-shape. The stretch
 * past the last pillar (flat-forward extrapolation) is dashed. The crosshair follows the shared
 * hover position, so both charts show the same maturity.
 */
export const RateChart = memo(function RateChart(props: RateChartProps) {
  const { name, description, lines, markers = [], pillars = NO_PILLARS, xMax, axis, xLabel, yLabel, bp } = props;
  const descId = useId();
  const [boxRef, W, measured] = useChartWidth<HTMLElement>(W0);
  const H = heightFor(W);
  const x = useMemo(() => maturityScale(axis, xMax, [M.left, W - M.right]), [axis, xMax, W]);
  const y = useMemo(() => {
    let lo = Infinity;
    let hi = -Infinity;
    for (const l of lines) for (const p of l.points) if (Number.isFinite(p.y)) ((lo = Math.min(lo, p.y)), (hi = Math.max(hi, p.y)));
    for (const m of markers) ((lo = Math.min(lo, m.y)), (hi = Math.max(hi, m.y)));
    if (!Number.isFinite(lo)) ((lo = 0), (hi = 0.05));
    const pad = Math.max((hi - lo) * 0.08, bp ? 1 : 0.0005);
    return scaleLinear().domain([lo - pad, hi + pad]).range([H - M.bottom, M.top]).nice(6);
  }, [lines, markers, H, bp]);
  const paths = useMemo(() => {
    if (!measured) return [];
    const gen = line<SamplePoint>()
      .x((p) => x(p.x))
      .y((p) => y(p.y))
      .defined((p) => Number.isFinite(p.y))
      .curve(curveLinear)
      .digits(2);
    return lines.map((l) => {
      const inside = l.points.filter((p) => !p.extrapolated);
      const firstOut = l.points.findIndex((p) => p.extrapolated);
      const outside = firstOut < 0 ? [] : l.points.slice(Math.max(0, firstOut - 1));
      return { l, solid: gen(inside) ?? '', dashed: outside.length > 1 ? (gen(outside) ?? '') : '' };
    });
  }, [lines, x, y, measured]);
  // Until its box is read (a layout effect, before the first paint) the chart is an empty frame of
  // the fallback size: the plot is drawn once, at its width (performance: a 500-quote workspace's
  // markers and pillar ticks, drawn and then moved, were a large part of the first render).
  if (!measured) {
    return (
      <figure className="chart" ref={boxRef}>
        <svg role="img" aria-label={name} viewBox={`0 0 ${W} ${H}`} width={W} height={H} />
      </figure>
    );
  }
  // Fewer x ticks on a narrow chart, so tick labels never overlap at full size.
  const xTicks = thinTicks(maturityTicks(axis, xMax), x, 30);
  const yTicks = y.ticks(H < 300 ? 5 : 6);

  const toX = (e: PointerEvent<SVGSVGElement>): number => {
    const box = e.currentTarget.getBoundingClientRect();
    const px = ((e.clientX - box.left) / Math.max(1, box.width)) * W;
    return Math.min(xMax, Math.max(0, x.invert(px)));
  };
  const onKeyDown = (e: KeyboardEvent<SVGSVGElement>): void => {
    const pts = lines[0]?.points ?? [];
    if (pts.length === 0) return;
    const cur = hoverStore.get();
    const i = cur === null ? -1 : nearestIndex(pts, cur);
    const step = e.shiftKey ? 10 : 1;
    let next: number | null = null;
    if (e.key === 'ArrowRight') next = Math.min(pts.length - 1, i + step);
    else if (e.key === 'ArrowLeft') next = Math.max(0, i < 0 ? 0 : i - step);
    else if (e.key === 'Home') next = 0;
    else if (e.key === 'End') next = pts.length - 1;
    else if (e.key === 'Escape') {
      hoverStore.set(null);
      return;
    } else return;
    e.preventDefault();
    hoverStore.set(pts[next]!.x);
  };

  return (
    <figure className="chart" ref={boxRef}>
      <svg
        role="img"
        aria-label={name}
        aria-describedby={descId}
        viewBox={`0 0 ${W} ${H}`}
        width={W}
        height={H}
        tabIndex={0}
        onPointerMove={(e) => hoverStore.set(toX(e))}
        onPointerLeave={() => hoverStore.set(null)}
        onKeyDown={onKeyDown}
        onBlur={() => hoverStore.set(null)}
      >
        <g className="grid">
          {yTicks.map((v) => (
            <line key={`gy${v}`} x1={M.left} x2={W - M.right} y1={y(v)} y2={y(v)} stroke={PALETTE.grid} />
          ))}
          {xTicks.map((v) => (
            <line key={`gx${v}`} y1={M.top} y2={H - M.bottom} x1={x(v)} x2={x(v)} stroke={PALETTE.grid} />
          ))}
        </g>
        {props.lastT < xMax && (
          <rect x={x(props.lastT)} y={M.top} width={Math.max(0, W - M.right - x(props.lastT))} height={H - M.top - M.bottom} fill="#f4f5f7">
            <title>Past the last pillar: flat-forward extrapolation</title>
          </rect>
        )}
        <ChartAxes w={W} h={H} m={M} x={x} y={y} xTicks={xTicks} yTicks={yTicks} yTickText={bp ? bpFigure : yTickText} xLabel={xLabel} yLabel={yLabel} fontPx={CHART_FONT_PX} />
        <PillarTicks pillars={pillars} x={x} h={H} />
        {paths.map(({ l, solid, dashed }) => (
          <g key={l.id} data-series={l.id}>
            <path d={solid} fill="none" stroke={l.colour} strokeWidth={l.width ?? 2} strokeDasharray={l.dash} strokeLinejoin="round" />
            {dashed && <path d={dashed} fill="none" stroke={l.colour} strokeWidth={l.width ?? 2} strokeDasharray="5 4" opacity={0.8} data-extrapolated="true" />}
          </g>
        ))}
        {markers.map((m, i) => (
          <circle key={`m${i}`} cx={x(m.x)} cy={y(m.y)} r={3.2} fill="#fff" stroke={PALETTE.marker} strokeWidth={1.5}>
            <title>{m.label}</title>
          </circle>
        ))}
        <Crosshair lines={lines} x={x} y={y} h={H} />
      </svg>
      <figcaption id={descId} className="chart-caption">
        <span className="sr-only">{description} </span>
        <Readout lines={lines} bp={bp} />
      </figcaption>
      {props.explain && <ExplainPoint lines={lines} {...props.explain} />}
    </figure>
  );
});

/**
 * The pillar dates as ticks on the x axis. Memoised: a value edit keeps the pillars (the same
 * list, see baseCurveSeries) and the x scale, so their elements are not rendered again.
 */
const PillarTicks = memo(function PillarTicks({ pillars, x, h: H }: { pillars: NonNullable<RateChartProps['pillars']>; x: (v: number) => number; h: number }) {
  return (
    <>
      {pillars.map((p) => (
        <line key={`p${p.date}`} x1={x(p.x)} x2={x(p.x)} y1={H - M.bottom} y2={H - M.bottom - 7} stroke={PALETTE.pillar} strokeWidth={1.5}>
          <title>{`Pillar ${p.date}`}</title>
        </line>
      ))}
    </>
  );
});

/** Keeps ticks at least `gap` px apart (the first always kept), dropping those in between. */
function thinTicks(ticks: readonly number[], x: (v: number) => number, gap: number): number[] {
  const kept: number[] = [];
  for (const t of ticks) if (kept.length === 0 || x(t) - x(kept[kept.length - 1]!) >= gap) kept.push(t);
  return kept;
}

function Crosshair({ lines, x, y, h: H }: { lines: readonly ChartLine[]; x: (v: number) => number; y: (v: number) => number; h: number }) {
  const hx = useHoverX();
  if (hx === null) return null;
  const px = x(hx);
  return (
    <g className="crosshair" pointerEvents="none">
      <line x1={px} x2={px} y1={M.top} y2={H - M.bottom} stroke={PALETTE.crosshair} strokeDasharray="3 3" />
      {lines.map((l) => {
        const i = nearestIndex(l.points, hx);
        const p = l.points[i];
        if (!p || Math.abs(p.x - hx) > 0.6) return null;
        return <circle key={l.id} cx={x(p.x)} cy={y(p.y)} r={3.5} fill={l.colour} stroke="#fff" />;
      })}
    </g>
  );
}

/** The values under the crosshair, as text (also what a keyboard or screen-reader user reads). */
function Readout({ lines, bp }: { lines: readonly ChartLine[]; bp?: boolean | undefined }) {
  const hx = useHoverX();
  if (hx === null) return <span className="readout muted">Point at a chart, or focus it and use the arrow keys, to read values.</span>;
  const first = lines[0]?.points[nearestIndex(lines[0]?.points ?? [], hx)];
  return (
    <span className="readout" aria-live="polite">
      <strong>{first ? `${formatNumber(first.x, 2)}y (${first.date})` : `${formatNumber(hx, 2)}y`}</strong>
      {lines.map((l) => {
        const p = l.points[nearestIndex(l.points, hx)];
        if (!p || Math.abs(p.x - hx) > 0.6) return null;
        return (
          <span key={l.id} className="readout-item">
            <span className="swatch" style={{ background: l.colour }} aria-hidden="true" />
            {l.label} {bp ? formatBp(p.y) : formatPercent(p.y)} <span className="tag">{l.tag}</span>
            {p.extrapolated ? ' (extrapolated)' : ''}
          </span>
        );
      })}
    </span>
  );
}

/**
 * "Explain at 2.00y (date):" under the readout, then a button per explainable line (its label; its
 * accessible name the line and its own point), at the maturity last read by pointer or keyboard
 * (kept when the pointer leaves the chart or the focus moves to a button).
 */
function ExplainPoint({ lines, words, open }: { lines: readonly ChartLine[]; words: string; open: (cell: unknown, button: HTMLElement) => void }) {
  const hx = useHoverX();
  const [last, setLast] = useState<number | null>(null);
  if (hx !== null && hx !== last) setLast(hx);
  const at = (p: SamplePoint): string => `${formatNumber(p.x, 2)}y (${p.date})`;
  const pointOf = (l: ChartLine): SamplePoint | undefined => {
    const p = last === null ? undefined : l.points[nearestIndex(l.points, last)];
    return p && Math.abs(p.x - last!) <= 0.6 ? p : undefined;
  };
  const p0 = lines[0] && pointOf(lines[0]);
  if (!p0) return <button type="button" className="linklike small chart-explain" disabled>{`Explain a ${words}: read a point first`}</button>;
  return (
    <p className="small chart-explain">
      Explain at {at(p0)}:
      {lines.map((l, i) => {
        const p = l.explain && pointOf(l);
        return (
          p && (
            <button key={l.id} type="button" className="linklike" aria-label={i ? `Explain ${l.label} at ${at(p)}` : `Explain the ${words} at ${at(p)}`} onClick={(e) => open(l.explain!(p), e.currentTarget)}>
              {l.label}
              <span className="sr-only"> at {at(p)}</span>
            </button>
          )
        );
      })}
    </p>
  );
}
