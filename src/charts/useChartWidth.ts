import { useLayoutEffect, useRef, useState, type RefObject } from 'react';

/**
 * The laid-out width of an element in CSS pixels, followed with a ResizeObserver (window resizes,
 * zoom, a panel opening). Charts draw in this many user units, so their text keeps its CSS size
 * while the plot area grows or shrinks; `fallback` is used before the first measurement and where
 * layout is not available (a test DOM). Only size changes re-render: an edit does not measure.
 * The third value says whether the box has been read (in a layout effect, so before the first
 * paint): a chart can leave its plot out until then and draw it once, at its size.
 */
export function useChartWidth<T extends Element>(fallback: number): [RefObject<T>, number, boolean] {
  const ref = useRef<T>(null);
  const [width, setWidth] = useState(fallback);
  const [measured, setMeasured] = useState(false);
  useLayoutEffect(() => {
    const el = ref.current;
    if (!el) return;
    const read = (w: number): void => {
      // Whole pixels, and never below a floor at which the axes still fit.
      if (w > 0) setWidth(Math.max(MIN_CHART_WIDTH, Math.round(w)));
    };
    read(el.getBoundingClientRect().width);
    setMeasured(true);
    if (typeof ResizeObserver !== 'function') return;
    const observer = new ResizeObserver((entries) => read(entries[0]?.contentRect.width ?? 0));
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return [ref, width, measured];
}

/** The narrowest a chart is drawn (CSS pixels); a narrower box scales it down. */
export const MIN_CHART_WIDTH = 240;
