import { loadedOvernightKit } from '../../hooks/overnightKit.ts';
import { scaleLinear } from 'd3-scale';
import { curveLinear, line } from 'd3-shape';
import { buildCurve, sampleGrid, toEngineDocument, zeroSamples, type WorkbenchDocument } from '../../core/index.ts';
import { parseRowCached } from '../../hooks/useCurveBuild.ts';

/** A tiny picture of a workspace's zero curve: an SVG path and the range it spans. */
export interface Sparkline {
  readonly path: string;
  /** Lowest and highest zero rate drawn (decimals), in the document's display compounding and day count. */
  readonly low: number;
  readonly high: number;
  readonly compounding: WorkbenchDocument['display']['compounding'];
  readonly dayCount: WorkbenchDocument['display']['dayCount'];
}

export const SPARK_WIDTH = 96;
export const SPARK_HEIGHT = 26;
const SPARK_POINTS = 48;

/** Derived per document object (never stored): a one-cell edit makes a new document, so a new line. */
const cache = new WeakMap<WorkbenchDocument, Sparkline | null>();

/**
 * The zero curve of a saved workspace, built through the core from its inputs and sampled from
 * settlement to its last pillar in the workspace's display convention; null when it builds no
 * curve. The path is scaled into SPARK_WIDTH x SPARK_HEIGHT with a pixel of margin.
 */
export function zeroSparkline(doc: WorkbenchDocument): Sparkline | null {
  if (cache.has(doc)) return cache.get(doc)!;
  let out: Sparkline | null = null;
  try {
    const kit = loadedOvernightKit();
    const build = buildCurve(toEngineDocument({ ...doc, curves: undefined }, parseRowCached).doc, kit ? { skipInvalid: true, overnight: kit } : { skipInvalid: true });
    const curve = build.curve;
    const last = curve?.pillars[curve.pillars.length - 1];
    if (curve && last) {
      const grid = sampleGrid(curve.settlement, last.date, SPARK_POINTS, curve.dayCount, doc.display.dayCount, { n: 3, unit: 'M' });
      const s = zeroSamples(curve, grid, doc.display.compounding);
      const ys = Array.from(s.y);
      if (ys.length >= 2 && ys.every(Number.isFinite)) {
        const low = Math.min(...ys);
        const high = Math.max(...ys);
        const x = scaleLinear().domain([s.x[0]!, s.x[s.x.length - 1]!]).range([1, SPARK_WIDTH - 1]);
        const y = scaleLinear().domain(low === high ? [low - 1e-4, high + 1e-4] : [low, high]).range([SPARK_HEIGHT - 2, 2]);
        const path = line<number>()
          .x((_, i) => x(s.x[i]!))
          .y((v) => y(v))
          .curve(curveLinear)(ys);
        if (path) out = { path, low, high, compounding: doc.display.compounding, dayCount: doc.display.dayCount };
      }
    }
  } catch {
    out = null;
  }
  cache.set(doc, out);
  return out;
}
