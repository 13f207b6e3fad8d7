import type { StateCreator } from 'zustand';
import {
  capRows,
  EMPTY_ROW_TEXT,
  LIMITS,
  conventionsOf,
  rewriteDateOrder,
  withDecimalPoint,
  type InputConventions,
  QUOTE_COLUMNS,
  type PastedBlock,
  rewriteBareRate,
  type DisplaySettings,
  type QuoteColumn,
  type QuoteRow,
  type QuoteUnitMode,
  type RowText,
  type WorkbenchDocument,
} from '../../core/index.ts';
import type { AppState } from '../appState.ts';
import type { PendingPaste } from './uiSlice.ts';
import { demoWorkspace } from '../demoWorkspace.ts';
import { makeRowId } from '../ids.ts';
import { maturitySortKey } from '../maturitySort.ts';
import { pasteTools } from '../pasteTools.ts';

/** Keys of the document that other panels own; the workbench stores and undoes them untouched. */
export type ReservedKey = 'strategy' | 'scenarios' | 'snapshots' | 'view' | 'note';

export interface PasteTarget {
  /** Row index of the focused cell (rows past the end are appended). */
  readonly row: number;
  readonly column: QuoteColumn;
}

export interface WorkspaceSlice {
  workspace: WorkbenchDocument;
  setCell(rowId: string, column: QuoteColumn, text: string): void;
  setRowEnabled(rowId: string, enabled: boolean): void;
  /** Adds an empty row after the given row (at the end when null); returns its id ('' when the sheet is full or read-only). */
  addRow(afterRowId?: string | null): string;
  deleteRow(rowId: string): void;
  sortByMaturity(): void;
  setSettlement(text: string): void;
  setCurve(patch: Partial<WorkbenchDocument['curve']>): void;
  /** Replaces the workspace's overnight fixings (rates as decimals by date), or removes them (null or empty). One undoable step. */
  setFixings(fixings: Readonly<Record<string, number>> | null): void;
  /** Sets the model that fills the futures' convexity adjustments (`curve.futuresConvexity`), or removes it (null). One undoable step. */
  setFuturesConvexity(model: Readonly<Record<string, unknown>> | null): void;
  /** Replaces one built-in calendar's edits (dates closed and opened); empty edits remove its entry. One undoable step. */
  setCalendarEdits(id: string, edits: { readonly add: readonly string[]; readonly remove: readonly string[] }): void;
  /**
   * Saves a calendar of the workspace's own from a list of dates, or deletes it (null); deleting
   * the one joined to the rows' calendar also ends the join. One undoable step.
   */
  setCustomCalendar(name: string, holidays: readonly string[] | null): void;
  /** Joins a calendar of the workspace's own to the deposit and OIS rows' calendar, or ends the join (null). One undoable step. */
  setJoinCalendar(name: string | null): void;
  /** Replaces the turns (empty: the section is removed). One undoable step. */
  setTurns(turns: WorkbenchDocument['turns'] & object): void;
  /** Replaces the meeting steps (null: the section is removed). One undoable step. */
  setMeetingSteps(steps: WorkbenchDocument['meetingSteps'] | null): void;
  setDisplay(patch: Partial<DisplaySettings>): void;
  /** Switches how bare numbers are read; bare rate and coupon texts are re-written so their values stay the same. */
  setQuoteUnit(mode: QuoteUnitMode): void;
  /**
   * Sets how typed dates and numbers are read (date order, decimal mark). A numeric date is
   * re-written in the new order so it keeps its date; a change of decimal mark changes no value
   * read before (numbers without a comma read the same either way).
   */
  setConventions(patch: Partial<InputConventions>): void;
  /**
   * Pastes a block. With a header row it replaces the sheet (the notice offers to append
   * instead); without one it fills from the target cell in column order.
   */
  pasteText(text: string, target: PasteTarget | null): void;
  /**
   * The sheet's paste: a block with a header is shown as a column-mapping preview (`pendingPaste`)
   * and nothing changes until `confirmPaste`; a block without one fills from the target cell.
   */
  previewPasteText(text: string, target: PasteTarget | null): void;
  /** previewPasteText for a block already read (by the paste worker), with its preview when it has a header. */
  receivePastedBlock(block: PastedBlock, target: PasteTarget | null, preview?: PendingPaste['preview'] | null, dropped?: number): void;
  /** Reports a paste refused before it was read (its size), changing nothing. */
  refusePaste(message: string): void;
  /** Applies the previewed paste: replacing the sheet (refused when it would leave no quote) or appended. */
  confirmPaste(how: 'replace' | 'append'): void;
  /** Turns the last replacing paste into an append (one undo step either way). */
  appendInstead(): void;
  setReserved(key: ReservedKey, value: unknown): void;
  /** Replaces the whole document (reset to demo, import) as one undoable step. */
  replaceWorkspace(doc: WorkbenchDocument, label: string): void;
  resetToDemo(): void;
}

const newRow = (text: Partial<RowText> = {}): QuoteRow => ({ id: makeRowId(), enabled: true, ...EMPTY_ROW_TEXT, ...text });

/** Cell text within LIMITS.cell (the sheet's inputs stop typing there; a pasted cell beyond it is cut and counted). */
const capCell = (text: string): string => (text.length > LIMITS.cell ? text.slice(0, LIMITS.cell) : text);
const capRowText = (r: Partial<RowText>, count: () => void): Partial<RowText> => {
  let out: Record<string, string> | null = null;
  for (const [k, v] of Object.entries(r)) {
    if (typeof v === 'string' && v.length > LIMITS.cell) {
      out ??= { ...(r as Record<string, string>) };
      out[k] = capCell(v);
      count();
    }
  }
  return (out ?? r) as Partial<RowText>;
};

export const createWorkspaceSlice: StateCreator<AppState, [], [], WorkspaceSlice> = (set, get) => {
  const ws = (): WorkbenchDocument => get().workspace;
  const withQuotes = (quotes: readonly QuoteRow[]): WorkbenchDocument => ({ ...ws(), quotes });
  const mapRow = (rowId: string, f: (r: QuoteRow) => QuoteRow): readonly QuoteRow[] => ws().quotes.map((r) => (r.id === rowId ? f(r) : r));
  /**
   * A header paste: replaces the sheet or appends to it, unless the preview refuses (no quote among
   * the rows kept). Beyond the quote cap the first rows are kept and the notice says how many were
   * left out; a cell longer than the cell cap is cut and counted.
   */
  const applyHeaderPaste = (block: PastedBlock, how: 'replace' | 'append', dropped = 0): void => {
    const before = ws().quotes;
    const preview = pasteTools().previewPaste(block, ws().quoteUnit, before.length, conventionsOf(ws()));
    const refusal = how === 'replace' ? preview.refusal : preview.appendRefusal;
    if (refusal) {
      set({ pasteNotice: { mode: 'refused', rows: block.rows.length, ignoredColumns: block.ignored, message: refusal } });
      return;
    }
    let clippedCells = 0;
    const clipped = (): void => {
      clippedCells++;
    };
    const capped = capRows(block.rows, how === 'replace' ? 0 : before.length);
    const kept = capped.rows;
    const leftOut = capped.leftOut + dropped;
    const pasted = kept.map((r) => capRowText(r, clipped) as RowText);
    if (how === 'replace') {
      get().commit(withQuotes(pasted.map((r) => newRow(r))), 'paste (replace sheet)');
      set({ pasteNotice: { mode: 'replaced', rows: pasted.length, ignoredColumns: block.ignored, before, pasted, leftOut, clippedCells } });
    } else {
      get().commit(withQuotes([...before, ...pasted.map((r) => newRow(r))]), 'paste (append)');
      set({ pasteNotice: { mode: 'appended', rows: pasted.length, ignoredColumns: block.ignored, leftOut, clippedCells } });
    }
  };
  /**
   * A header-less paste: fills from the target cell in column order, adding rows past the end up
   * to the quote cap (a sheet already over it, from an older build, keeps its rows); rows beyond
   * are left out and counted, a cell beyond the cell cap is cut and counted.
   */
  const fillFrom = (block: PastedBlock, target: PasteTarget | null, dropped = 0): void => {
    if (block.cells.length === 0) return;
    let clippedCells = 0;
    const quotes = [...ws().quotes];
    const startRow = target ? Math.max(0, target.row) : quotes.length;
    const startCol = target ? QUOTE_COLUMNS.indexOf(target.column) : 0;
    const lastRow = Math.max(LIMITS.quotes, quotes.length);
    const capped = capRows(block.cells, LIMITS.quotes - Math.max(0, lastRow - startRow));
    const cells = capped.rows;
    const leftOut = capped.leftOut + dropped;
    cells.forEach((rowCells, i) => {
      const at = startRow + i;
      const base = quotes[at] ?? newRow();
      const patch: Partial<Record<QuoteColumn, string>> = {};
      rowCells.forEach((value, j) => {
        const col = QUOTE_COLUMNS[startCol + j];
        if (col) {
          if (value.length > LIMITS.cell) clippedCells++;
          patch[col] = capCell(value);
        }
      });
      const row = { ...base, ...patch };
      if (at < quotes.length) quotes[at] = row;
      else quotes.push(row);
    });
    if (cells.length > 0) get().commit(withQuotes(quotes), 'paste');
    set({ pasteNotice: { mode: 'filled', rows: cells.length, ignoredColumns: [], leftOut, clippedCells } });
  };
  return {
    workspace: demoWorkspace(makeRowId),
    setCell(rowId, column, text) {
      const row = ws().quotes.find((r) => r.id === rowId);
      text = capCell(text);
      if (!row || row[column] === text) return;
      get().commit(withQuotes(mapRow(rowId, (r) => ({ ...r, [column]: text }))), `edit ${column}`, `cell:${rowId}:${column}`);
    },
    setRowEnabled(rowId, enabled) {
      get().commit(withQuotes(mapRow(rowId, (r) => ({ ...r, enabled }))), enabled ? 'switch row on' : 'switch row off');
    },
    addRow(afterRowId = null) {
      // The sheet holds at most LIMITS.quotes rows (the Add row control says so and is disabled there).
      if (ws().quotes.length >= LIMITS.quotes || get().readOnly) return '';
      const row = newRow();
      const quotes = [...ws().quotes];
      const at = afterRowId === null ? -1 : quotes.findIndex((r) => r.id === afterRowId);
      if (at < 0) quotes.push(row);
      else quotes.splice(at + 1, 0, row);
      get().commit(withQuotes(quotes), 'add row');
      return row.id;
    },
    deleteRow(rowId) {
      const quotes = ws().quotes.filter((r) => r.id !== rowId);
      if (quotes.length === ws().quotes.length) return;
      get().commit(withQuotes(quotes), 'delete row');
      if (get().selectedRowId === rowId) set({ selectedRowId: null });
    },
    sortByMaturity() {
      const settlement = ws().settlement;
      const order = conventionsOf(ws()).dateOrder;
      const keyed = ws().quotes.map((r, i) => ({ r, i, k: maturitySortKey(r.maturity, settlement, order) }));
      keyed.sort((a, b) => a.k - b.k || a.i - b.i);
      if (keyed.every((x, i) => x.i === i)) return;
      get().commit(withQuotes(keyed.map((x) => x.r)), 'sort by maturity');
    },
    setSettlement(text) {
      text = text.length > LIMITS.setting ? text.slice(0, LIMITS.setting) : text;
      if (text === ws().settlement) return;
      get().commit({ ...ws(), settlement: text }, 'settlement date', 'settlement');
    },
    setCurve(patch) {
      get().commit({ ...ws(), curve: { ...ws().curve, ...patch } }, 'curve settings');
    },
    setFixings(fixings) {
      const { fixings: _old, ...rest } = ws();
      get().commit(fixings === null || Object.keys(fixings).length === 0 ? rest : { ...rest, fixings }, 'overnight fixings');
    },
    setFuturesConvexity(model) {
      const { futuresConvexity: _old, ...curve } = ws().curve;
      get().commit({ ...ws(), curve: model === null ? curve : { ...curve, futuresConvexity: model } }, 'futures convexity');
    },
    setCalendarEdits(id, edits) {
      const { [id]: _old, ...others } = ws().calendars ?? {};
      const sorted = (xs: readonly string[]) => [...new Set(xs)].sort();
      const entry = edits.add.length + edits.remove.length > 0 ? { [id]: { add: sorted(edits.add), remove: sorted(edits.remove) } } : {};
      const calendars = { ...others, ...entry };
      const { calendars: _c, ...rest } = ws();
      get().commit(Object.keys(calendars).length > 0 ? { ...rest, calendars } : rest, 'calendar edits');
    },
    setCustomCalendar(name, holidays) {
      const { [name]: _old, ...others } = ws().customCalendars ?? {};
      const customCalendars = holidays === null ? others : { ...others, [name]: { holidays: [...new Set(holidays)].sort() } };
      const { customCalendars: _c, ...rest } = ws();
      const { joinCalendar, ...curve } = ws().curve;
      const keepJoin = joinCalendar !== undefined && joinCalendar in customCalendars;
      get().commit({ ...rest, curve: keepJoin ? ws().curve : curve, ...(Object.keys(customCalendars).length > 0 ? { customCalendars } : {}) }, holidays === null ? 'delete own calendar' : 'own calendar');
    },
    setJoinCalendar(name) {
      const { joinCalendar: _j, ...curve } = ws().curve;
      get().commit({ ...ws(), curve: name === null ? curve : { ...curve, joinCalendar: name } }, 'joined calendar');
    },
    setTurns(turns) {
      const { turns: _t, ...rest } = ws();
      get().commit(turns.length > 0 ? { ...rest, turns } : rest, 'turns');
    },
    setMeetingSteps(steps) {
      const { meetingSteps: _m, ...rest } = ws();
      get().commit(steps === null || steps === undefined ? rest : { ...rest, meetingSteps: steps }, 'meeting steps');
    },
    setDisplay(patch) {
      get().commit({ ...ws(), display: { ...ws().display, ...patch } }, 'display settings');
    },
    setQuoteUnit(mode) {
      const from = ws().quoteUnit;
      if (from === mode) return;
      const mark = conventionsOf(ws()).decimalMark;
      // With a decimal comma, the number is re-written through its point form and given its comma back.
      const rewrite = (text: string): string => {
        const point = withDecimalPoint(text, mark);
        const out = rewriteBareRate(point, from, mode);
        return out === point ? text : mark === ',' ? out.replace('.', ',') : out;
      };
      const quotes = ws().quotes.map((r) => {
        const rate = rewrite(r.rate);
        const coupon = rewrite(r.coupon);
        return rate === r.rate && coupon === r.coupon ? r : { ...r, rate, coupon };
      });
      get().commit({ ...ws(), quoteUnit: mode, quotes }, 'quote unit');
    },
    setConventions(patch) {
      const before = conventionsOf(ws());
      const next = { ...before, ...patch };
      if (next.dateOrder === before.dateOrder && next.decimalMark === before.decimalMark) return;
      const quotes =
        next.dateOrder === before.dateOrder
          ? ws().quotes
          : ws().quotes.map((r) => {
              const maturity = rewriteDateOrder(r.maturity, before.dateOrder, next.dateOrder);
              return maturity === r.maturity ? r : { ...r, maturity };
            });
      get().commit({ ...ws(), quotes, display: { ...ws().display, ...next } }, 'date and number settings');
    },
    pasteText(text, target) {
      if (get().readOnly) return;
      const block = pasteTools().readPastedBlock(text);
      if (block.header) applyHeaderPaste(block, 'replace');
      else fillFrom(block, target);
    },
    previewPasteText(text, target) {
      if (get().readOnly) return;
      get().receivePastedBlock(pasteTools().readPastedBlock(text), target);
    },
    receivePastedBlock(block, target, preview = null, dropped = 0) {
      set({ pasteProgress: null });
      if (get().readOnly) return;
      if (!block.header) {
        set({ pendingPaste: null });
        fillFrom(block, target, dropped);
        return;
      }
      set({ pendingPaste: { block, preview: preview ?? pasteTools().previewPaste(block, ws().quoteUnit, ws().quotes.length, conventionsOf(ws())), dropped } });
    },
    refusePaste(message) {
      set({ pendingPaste: null, pasteProgress: null, pasteNotice: { mode: 'refused', rows: 0, ignoredColumns: [], message } });
    },
    confirmPaste(how) {
      const pending = get().pendingPaste;
      if (!pending) return;
      set({ pendingPaste: null });
      applyHeaderPaste(pending.block, how, pending.dropped ?? 0);
    },
    appendInstead() {
      const notice = get().pasteNotice;
      if (!notice || notice.mode !== 'replaced' || !notice.before || !notice.pasted || get().readOnly) return;
      const { rows: appended, leftOut } = capRows(notice.pasted, notice.before.length);
      const quotes = [...notice.before, ...appended.map((r) => newRow(r))];
      // Replace the paste's own undo step: the result is one step from the sheet before the paste.
      const s = get();
      const prior = s.past[s.past.length - 1];
      if (prior && prior.quotes === notice.before) {
        set({ workspace: { ...ws(), quotes }, future: [], lastEditKey: null });
      } else get().commit(withQuotes(quotes), 'paste (append)');
      set({ pasteNotice: { mode: 'appended', rows: appended.length, ignoredColumns: notice.ignoredColumns, leftOut: leftOut + (notice.leftOut ?? 0), clippedCells: notice.clippedCells ?? 0 } });
    },
    setReserved(key, value) {
      const next = { ...ws() } as Record<string, unknown>;
      if (value === undefined) delete next[key];
      else next[key] = value;
      get().commit(next as unknown as WorkbenchDocument, key);
    },
    replaceWorkspace(doc, label) {
      get().commit(doc, label);
      set({ selectedRowId: null, pasteNotice: null, pendingPaste: null });
    },
    resetToDemo() {
      get().replaceWorkspace(demoWorkspace(makeRowId), 'reset to demo');
    },
  };
};
