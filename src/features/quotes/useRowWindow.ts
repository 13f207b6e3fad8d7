import { useCallback, useEffect, useLayoutEffect, useRef, useState, type RefObject } from 'react';

/** At or below this many rows the sheet renders every row; above it, only the rows in view. */
export const WINDOW_FROM_ROWS = 30;
/** Estimated heights (CSS pixels) of a sheet row and of a row's message line, until measured. */
const ROW_ESTIMATE_PX = 26;
const MESSAGE_ESTIMATE_PX = 19;
/** Rows rendered beyond the visible part, above and below, so scrolling and Tab find them ready. */
const OVERSCAN_PX = 160;
/**
 * The view's edges are widened to multiples of this many pixels (about four rows) before the
 * window is computed, so scrolling by a row (an arrow key at the edge of the view) re-renders the
 * sheet once every few rows instead of on every move (performance: the re-render and the row it
 * mounted were most of a move's script time on a 360-row sheet).
 */
const SNAP_PX = 104;

/** The part of the scroll container in view, its edges widened to SNAP_PX multiples. */
const snappedView = (el: HTMLElement): { top: number; height: number } => {
  const top = Math.floor(el.scrollTop / SNAP_PX) * SNAP_PX;
  return { top, height: Math.ceil((el.scrollTop + el.clientHeight) / SNAP_PX) * SNAP_PX - top };
};

/**
 * The view assumed before the sheet's box is first read (its CSS max-height): a large sheet
 * restored on load renders about a view of rows on its first frame instead of all of them
 * (performance: the first layout of 500 rendered rows was most of a 400 ms task on reload).
 */
const FIRST_VIEW_PX = 640;

/** A run of consecutive rows to render, or a gap of rows left out (rendered as one spacer). */
export type WindowPart = { readonly kind: 'rows'; readonly from: number; readonly to: number } | { readonly kind: 'gap'; readonly heightPx: number; readonly key: string };

export interface RowWindow {
  /** Rows and gaps in sheet order. All rows in one part when the sheet is small or not laid out. */
  readonly parts: readonly WindowPart[];
  /** Scrolls row `index` into view (it is rendered by the next paint) and then calls `then`. */
  readonly reveal: (index: number, then: () => void) => void;
}

interface RowInfo {
  readonly key: string;
  readonly hasMessage: boolean;
}

/**
 * Windowed rendering of the quote sheet's rows inside the scroll container `scrollRef`: a large
 * sheet (a 500-row paste) renders the rows in view plus a margin, with spacers standing in for
 * the rest, so a paste or an edit costs the same for 50 rows as for 500. Row heights start as
 * estimates and are replaced by measured ones as rows render. `pinnedRef`: a row kept rendered
 * wherever the view is (the row holding the focus, so typing is never cut off by a scroll).
 * UI only: nothing here touches the workspace or the numbers.
 */
export function useRowWindow(scrollRef: RefObject<HTMLElement | null>, rows: readonly RowInfo[], pinnedRef: RefObject<number | null>): RowWindow {
  // height -1: not read yet (FIRST_VIEW_PX is assumed); 0: not laid out (every row is rendered).
  const [view, setView] = useState({ top: 0, height: -1 });
  // Read at render time: the focused row changes on every arrow move and needs no render of its
  // own (it is rendered while it has the focus); it matters once the view moves, which renders.
  const pinned = pinnedRef.current;
  const [, setVersion] = useState(0);
  const measured = useRef(new Map<string, number>());
  // The measured height of a row without a message line, once one is known (the estimate for the rest).
  const typicalRow = useRef(ROW_ESTIMATE_PX);
  const pendingReveal = useRef<{ index: number; then: () => void } | null>(null);

  useEffect(() => {
    const el = scrollRef.current;
    if (!el) return;
    let frame = 0;
    const read = (): void => {
      frame = 0;
      const next = snappedView(el);
      setView((v) => (v.top === next.top && v.height === next.height ? v : next));
    };
    const onScroll = (): void => {
      if (frame === 0) frame = requestAnimationFrame(read);
    };
    read();
    el.addEventListener('scroll', onScroll, { passive: true });
    const resize = typeof ResizeObserver === 'undefined' ? null : new ResizeObserver(onScroll);
    resize?.observe(el);
    return () => {
      el.removeEventListener('scroll', onScroll);
      resize?.disconnect();
      if (frame !== 0) cancelAnimationFrame(frame);
    };
  }, [scrollRef]);

  const heightOf = (r: RowInfo): number => measured.current.get(r.key) ?? typicalRow.current + (r.hasMessage ? MESSAGE_ESTIMATE_PX : 0);
  const windowed = rows.length > WINDOW_FROM_ROWS && view.height !== 0;
  const viewHeight = view.height < 0 ? FIRST_VIEW_PX : view.height;

  let parts: WindowPart[] = [{ kind: 'rows', from: 0, to: rows.length }];
  let offsets: number[] | null = null;
  if (windowed) {
    offsets = new Array<number>(rows.length + 1);
    offsets[0] = 0;
    for (let i = 0; i < rows.length; i++) offsets[i + 1] = offsets[i]! + heightOf(rows[i]!);
    const top = view.top - OVERSCAN_PX;
    const bottom = view.top + viewHeight + OVERSCAN_PX;
    let from = 0;
    while (from < rows.length && offsets[from + 1]! <= top) from++;
    let to = from;
    while (to < rows.length && offsets[to]! < bottom) to++;
    const runs: [number, number][] = [[from, to]];
    if (pinned !== null && pinned >= 0 && pinned < rows.length && (pinned < from || pinned >= to)) {
      runs.push([pinned, pinned + 1]);
      runs.sort((a, b) => a[0] - b[0]);
    }
    parts = [];
    let at = 0;
    runs.forEach(([a, b], k) => {
      // Keys by place (before the first run, between runs, after the last), stable while scrolling.
      if (a > at) parts.push({ kind: 'gap', heightPx: offsets![a]! - offsets![at]!, key: `gap-${k}` });
      parts.push({ kind: 'rows', from: a, to: b });
      at = b;
    });
    if (at < rows.length) parts.push({ kind: 'gap', heightPx: offsets[rows.length]! - offsets[at]!, key: 'gap-end' });
  }

  const rowsRef = useRef(rows);
  rowsRef.current = rows;
  const offsetsRef = useRef(offsets);
  offsetsRef.current = offsets;

  /** Finishes a reveal once its row is in the DOM (right after the commit that renders it). */
  const finishReveal = useCallback((): void => {
    const el = scrollRef.current;
    const pending = pendingReveal.current;
    if (el && pending && el.querySelector(`tr[data-row-index="${pending.index}"]`)) {
      pendingReveal.current = null;
      pending.then();
    }
  }, [scrollRef]);

  /**
   * Reads the heights of the rendered rows into the estimates. Runs in the frame after a commit,
   * when the page has been laid out for painting anyway, so it forces no extra layout on the
   * commit itself (performance: a forced layout cost a 500-row paste several milliseconds).
   * Re-renders only when the rendered rows turn out so far off their estimates that the margin
   * around the view might not cover it.
   */
  const measure = useCallback((): void => {
    const el = scrollRef.current;
    // A small sheet renders every row and needs no heights.
    if (!el || rowsRef.current.length <= WINDOW_FROM_ROWS) return;
    let drift = 0;
    for (const tr of el.querySelectorAll<HTMLTableRowElement>('tr[data-row-key]')) {
      const key = tr.dataset.rowKey!;
      let h = tr.getBoundingClientRect().height;
      const next = tr.nextElementSibling as HTMLElement | null;
      const withMessage = next?.dataset.messageFor === key;
      if (withMessage) h += next.getBoundingClientRect().height;
      else if (h > 0) typicalRow.current = h;
      if (h <= 0) continue;
      const before = measured.current.get(key) ?? typicalRow.current + (withMessage ? MESSAGE_ESTIMATE_PX : 0);
      drift += h - before;
      measured.current.set(key, h);
    }
    if (measured.current.size > 4 * rowsRef.current.length + 100) {
      // Forget rows that are gone (a replaced sheet), keeping the map from growing without bound.
      const live = new Set(rowsRef.current.map((r) => r.key));
      for (const key of measured.current.keys()) if (!live.has(key)) measured.current.delete(key);
    }
    if (Math.abs(drift) > OVERSCAN_PX / 3) setVersion((v) => v + 1);
  }, [scrollRef]);

  const reveal = useCallback(
    (index: number, then: () => void): void => {
      const el = scrollRef.current;
      if (!el || el.querySelector(`tr[data-row-index="${index}"]`)) {
        then();
        return;
      }
      const offs = offsetsRef.current;
      pendingReveal.current = { index, then };
      if (offs) el.scrollTop = Math.max(0, offs[index]! - el.clientHeight / 3);
      setView(snappedView(el));
    },
    [scrollRef],
  );

  useLayoutEffect(finishReveal);
  useEffect(() => {
    if (rows.length <= WINDOW_FROM_ROWS) return;
    const frame = requestAnimationFrame(measure);
    return () => cancelAnimationFrame(frame);
  });
  return { parts, reveal };
}
