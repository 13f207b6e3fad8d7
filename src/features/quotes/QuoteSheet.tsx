import { lazy, memo, Suspense, useCallback, useEffect, useMemo, useRef, useState, type ClipboardEvent, type FocusEvent, type KeyboardEvent, type MouseEvent } from 'react';
import {
  LIMITS,
  rowsLeftOutMessage,
  DATE_ORDER_LABEL,
  DATE_ORDERS,
  DECIMAL_MARK_LABEL,
  DECIMAL_MARKS,
  looksLikeTable,
  pasteSizeRefusal,
  textSizeWords,
  type DateOrder,
  type DecimalMark,
  QUOTE_COLUMN_LABEL,
  QUOTE_COLUMNS,
  QUOTE_UNIT_MODES,
  type QuoteColumn,
  type QuoteRow,
  type QuoteUnitMode,
  type RowIssues,
  sheetDefault,
  rowTermsOf,
  type RowConventions,
  type RowTerms,
} from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { useOnCurve } from '../../hooks/useNamedCurves.ts';
import { useRowWindow, WINDOW_FROM_ROWS } from './useRowWindow.ts';
import { WORKER_FROM_CHARS } from '../../share/offThread.ts';

/** The header-paste preview is fetched with the paste reader, on the first paste (its own chunk). */
const PastePreview = lazy(() => import('./PastePreview.tsx').then((m) => ({ default: m.PastePreview })));
const UNIT_TEXT: Readonly<Record<QuoteUnitMode, string>> = { percent: '%', decimal: 'decimal', bp: 'bp' };
/** Short column headings (the full names label the cells). */
const HEADER_TEXT: Readonly<Record<QuoteColumn, string>> = { kind: 'Kind', maturity: 'Maturity', rate: 'Rate', price: 'Price', coupon: 'Cpn', frequency: 'Freq', dayCount: 'Day count', terms: 'Conventions' };

/** Hints shown in a fresh (blank) row only, so they are never mistaken for values. */
const PLACEHOLDER: Readonly<Record<QuoteColumn, string>> = {
  kind: 'kind',
  maturity: '5Y / date',
  rate: 'rate',
  price: 'or price',
  coupon: 'bonds',
  frequency: '',
  dayCount: '',
  terms: '',
};

type NoteOf = (kindText: string, terms: RowTerms | null, frequencyCell: string, dayCountCell: string, market: string | undefined) => RowConventions | null;
/** The note's code once fetched (termsNote.ts: its own chunk, fetched when a set is first named). */
let loadedNote: NoteOf | null = null;
/** rowConventions once its chunk has arrived (null until then, or while no set is named anywhere). */
function useTermsNote(needed: boolean): NoteOf | null {
  // An initializer function: useState would call the note function itself.
  const [note, setNote] = useState<NoteOf | null>(() => loadedNote);
  useEffect(() => {
    if (!needed || note !== null) return;
    let live = true;
    void import('./termsNote.ts').then((m) => {
      loadedNote = m.rowConventions;
      if (live) setNote(() => m.rowConventions);
    });
    return () => {
      live = false;
    };
  }, [needed, note]);
  return note;
}

/** The engine's default for an empty frequency or day-count cell of a kind (its module's schema defaults), shown faintly. */
const defaultFor = (kind: string, c: QuoteColumn, market: string | undefined): string | undefined => sheetDefault(kind, c, market);

/** A row's messages, one per cell with an issue, in column order (shown on a line under the row). */
const rowMessages = (issues: RowIssues) => QUOTE_COLUMNS.flatMap((c) => (issues[c] ? [{ c, ...issues[c] }] : []));
/** Whether the row has that message line (it changes the row's height in a windowed sheet). */
const hasMessages = (issues: RowIssues): boolean => QUOTE_COLUMNS.some((c) => Boolean(issues[c]));

const issuesEqual = (a: RowIssues, b: RowIssues): boolean =>
  QUOTE_COLUMNS.every((c) => a[c]?.message === b[c]?.message && a[c]?.severity === b[c]?.severity);

interface RowViewProps {
  readonly row: QuoteRow;
  readonly index: number;
  readonly issues: RowIssues;
  readonly unit: QuoteUnitMode;
  readonly selected: boolean;
  readonly inCurve: boolean;
  /** The workspace's market conventions (a convention set id), whose fields the faint defaults show. */
  readonly market: string | undefined;
  /** The Conventions cell's note (rowConventions), once its code has arrived. */
  readonly noteOf: NoteOf | null;
}

/**
 * Moves focus to a cell, scrolling the sheet by no more than it takes to show it. The cell is
 * focused, not edited: its text is selected, so typing replaces it (see the sheet's keyboard model).
 */
function focusCell(grid: HTMLElement | null, row: number, column: string): void {
  const el = grid?.querySelector<HTMLInputElement>(`input[data-row="${row}"][data-col="${column}"]`);
  if (!el) return;
  el.focus({ preventScroll: true });
  el.scrollIntoView?.({ block: 'nearest', inline: 'nearest' });
  el.select();
}

/** The cell being edited: where, and its text when the edit began (what Escape goes back to). */
interface CellEdit {
  readonly el: HTMLInputElement;
  readonly rowId: string;
  readonly column: QuoteColumn;
}

/** A key that types into a focused cell (and so starts an edit with it): one character, or a deletion. */
const typesText = (e: KeyboardEvent): boolean => !e.ctrlKey && !e.metaKey && !e.altKey && (e.key.length === 1 || e.key === 'Backspace' || e.key === 'Delete');

interface SheetCellProps {
  readonly rowId: string;
  readonly column: QuoteColumn;
  readonly index: number;
  readonly value: string;
  readonly severity: 'error' | 'warning' | null;
  readonly message: string | null;
  readonly placeholder: string | undefined;
  readonly msgId: string;
  /** The Conventions cell's note: the set the row takes and what it overrides (its tooltip and description). */
  readonly note?: string | null;
  /** The Conventions cell of a row that takes the workspace's set and types fields of its own: that set, shown before them. */
  readonly prefix?: string | null;
  /** The row overrides a field of its set (the Conventions cell is marked). */
  readonly overrides?: boolean;
}

/** One text cell; memoised so a keystroke re-renders the cell typed in, not its whole row. */
const SheetCell = memo(function SheetCell({ rowId, column: c, index, value, severity, message, placeholder, msgId, note = null, prefix = null, overrides = false }: SheetCellProps) {
  const setCell = useAppStore((s) => s.setCell);
  const endEdit = useAppStore((s) => s.endEdit);
  const readOnly = useAppStore((s) => s.readOnly !== null);
  const title = message !== null && note !== null ? `${message}\n${note}` : (message ?? note ?? undefined);
  const input = (
    <input
      type="text"
      value={value}
      maxLength={LIMITS.cell}
      readOnly={readOnly}
      data-row={index}
      data-col={c}
      spellCheck={false}
      autoComplete="off"
      placeholder={placeholder}
      aria-label={`Row ${index + 1} ${QUOTE_COLUMN_LABEL[c]}`}
      aria-invalid={severity === 'error' ? true : undefined}
      aria-describedby={message ? msgId : undefined}
      aria-description={note ?? undefined}
      title={title}
      onChange={(e) => setCell(rowId, c, e.target.value)}
      onBlur={endEdit}
    />
  );
  return (
    <td role="gridcell" className={`cell ${c}${severity ? ` ${severity}` : ''}${overrides ? ' overrides' : ''}`}>
      {c !== 'terms' ? (
        input
      ) : (
        // The Conventions cell keeps one structure whether or not the set is shown before the text, so its input is never re-mounted while typed in.
        <div className="terms-wrap">
          {prefix !== null && (
            <span className="terms-set" aria-hidden="true">
              {prefix} ·
            </span>
          )}
          {input}
        </div>
      )}
    </td>
  );
});

/**
 * The row number's action: selects the row, opens the Quote check section (its repricing, and the
 * schedule of a bond or swap) and brings that section into view.
 */
function showRowDetails(rowId: string): void {
  const { selectRow, setActiveTab } = useAppStore.getState();
  selectRow(rowId);
  setActiveTab('quote-check');
  requestAnimationFrame(() => document.getElementById('tabpanel-quote-check')?.scrollIntoView?.({ block: 'nearest', behavior: 'auto' }));
}

const QuoteRowView = memo(
  function QuoteRowView({ row, index, issues, unit, selected, inCurve, market, noteOf }: RowViewProps) {
    const setRowEnabled = useAppStore((s) => s.setRowEnabled);
    const deleteRow = useAppStore((s) => s.deleteRow);
    const addRow = useAppStore((s) => s.addRow);
    // With named curves, each quote in the curve says which curve it builds and is discounted on (the sheet's: "default").
    const on = useOnCurve();
    const n = index + 1;
    const blank = QUOTE_COLUMNS.every((c) => (row[c] ?? '') === '');
    const messages = rowMessages(issues);
    const msgId = `row-msg-${row.id}`;
    const status = messages.some((m) => m.severity === 'error') ? 'error' : !row.enabled ? 'off' : inCurve ? 'ok' : 'idle';
    // The set the row takes (its own, else the workspace's) and the fields it gives itself.
    const terms = row.terms ?? '';
    const read = rowTermsOf(terms);
    const conv = blank || noteOf === null ? null : noteOf(row.kind, read, row.frequency, row.dayCount, market);
    const ownSet = read?.set ?? null;
    const setFor = ownSet ?? market;
    return (
      <>
        <tr role="row" aria-rowindex={n + 1} className={`sheet-row ${status}${selected ? ' selected' : ''}`} aria-selected={selected} data-row-key={row.id} data-row-index={index} title={on && inCurve ? `Builds and is discounted${on}` : undefined}>
          <td role="gridcell" className="rownum">
            <button type="button" className="linklike" onClick={() => showRowDetails(row.id)} aria-label={`Row ${n}: show its repricing and schedule`} title="Show repricing and schedule (opens Quote check)">
              {n}
            </button>
          </td>
          <td role="gridcell" className="on">
            <input type="checkbox" checked={row.enabled} aria-label={`Row ${n} in the curve`} onChange={(e) => setRowEnabled(row.id, e.target.checked)} />
          </td>
          {QUOTE_COLUMNS.map((c) => (
            <SheetCell
              key={c}
              rowId={row.id}
              column={c}
              index={index}
              value={row[c] ?? ''}
              severity={issues[c]?.severity ?? null}
              message={issues[c]?.message ?? null}
              placeholder={blank ? PLACEHOLDER[c] : defaultFor(row.kind, c, setFor)}
              msgId={msgId}
              {...(c === 'terms' && conv !== null
                ? { note: conv.title, prefix: conv.fromWorkspace && terms.trim() !== '' ? conv.set : null, overrides: conv.given.some((g) => g.setValue !== null && g.setValue !== g.value) }
                : {})}
            />
          ))}
          <td role="gridcell" className="actions">
            <button type="button" className="icon" aria-label={`Insert a row after row ${n}`} title="Insert row below" onClick={() => addRow(row.id)}>
              +
            </button>
            <button type="button" className="icon" aria-label={`Delete row ${n}`} title="Delete row" onClick={() => deleteRow(row.id)}>
              ×
            </button>
          </td>
        </tr>
        {messages.length > 0 && (
          <tr role="row" className={`sheet-message ${status}`} data-message-for={row.id}>
            <td role="gridcell" colSpan={QUOTE_COLUMNS.length + 3} id={msgId}>
              {messages.map((m) => (
                <span key={m.c} className={`msg ${m.severity}`}>
                  <strong>{QUOTE_COLUMN_LABEL[m.c]}:</strong> {m.message}
                </span>
              ))}
            </td>
          </tr>
        )}
      </>
    );
  },
  (a, b) => a.row === b.row && a.index === b.index && a.unit === b.unit && a.selected === b.selected && a.inCurve === b.inCurve && a.market === b.market && a.noteOf === b.noteOf && issuesEqual(a.issues, b.issues),
);

/**
 * The quote sheet: a grid whose cells keep the text as typed. Paste a block (tab-separated or
 * CSV) on any cell: with a header row it replaces the sheet, without one it fills from the
 * focused cell.
 */
export function QuoteSheet({ result }: { result: WorkbenchBuild }) {
  const rows = useAppStore((s) => s.workspace.quotes);
  const unit = useAppStore((s) => s.workspace.quoteUnit);
  const market = useAppStore((s) => s.workspace.curve.conventions);
  const noteOf = useTermsNote((market !== undefined && market !== 'none') || rows.some((r) => (r.terms ?? '') !== ''));
  const dateOrder = useAppStore((s) => s.workspace.display.dateOrder);
  const decimalMark = useAppStore((s) => s.workspace.display.decimalMark);
  const selectedRowId = useAppStore((s) => s.selectedRowId);
  const notice = useAppStore((s) => s.pasteNotice);
  const pendingPaste = useAppStore((s) => s.pendingPaste !== null);
  const readOnly = useAppStore((s) => s.readOnly !== null);
  const full = rows.length >= LIMITS.quotes;
  const { setQuoteUnit, setConventions, addRow, sortByMaturity, appendInstead, dismissPasteNotice } = useAppStore.getState();
  const progress = useAppStore((s) => s.pasteProgress);
  const cancelReading = useRef<(() => void) | null>(null);
  const gridRef = useRef<HTMLTableElement>(null);
  const scrollRef = useRef<HTMLDivElement>(null);
  // The row holding the focus, kept rendered in a windowed sheet. A ref, not state: an arrow move
  // re-renders nothing (the row is rendered while focused; the window reads this when the view moves).
  const focusedRow = useRef<number | null>(null);
  // The cell being edited, if any; the others are only focused (the arrow keys move between them).
  const editing = useRef<CellEdit | null>(null);
  const rowInfo = useMemo(
    () => rows.map((row, i) => ({ key: row.id, hasMessage: hasMessages(result.rowIssues[i] ?? {}) })),
    [rows, result.rowIssues],
  );
  const { parts, reveal } = useRowWindow(scrollRef, rowInfo, focusedRow);
  const moveTo = (row: number, column: string): void => reveal(row, () => focusCell(gridRef.current, row, column));
  // A link elsewhere (a quote behind an explained number) asks for a row: bring it into view and focus its first cell.
  const rowRequest = useAppStore((s) => s.rowRequest);
  useEffect(() => {
    if (!rowRequest) return;
    const i = useAppStore.getState().workspace.quotes.findIndex((r) => r.id === rowRequest.id);
    if (i >= 0) moveTo(i, QUOTE_COLUMNS[0]);
    // Only a new request moves the focus (not a re-render of the sheet).
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [rowRequest]);
  const onFocus = (e: FocusEvent<HTMLTableElement>): void => {
    if (editing.current && editing.current.el !== (e.target as Element)) stopEditing();
    if (rows.length <= WINDOW_FROM_ROWS) return;
    const r = (e.target as HTMLElement).dataset?.row;
    focusedRow.current = r === undefined ? null : Number(r);
  };
  const onBlur = (e: FocusEvent<HTMLTableElement>): void => {
    if (editing.current?.el === (e.target as Element)) stopEditing();
  };

  /** Starts editing a focused cell: a new undo step, caret at the end or (for typing over it) the text selected. */
  const startEditing = (el: HTMLInputElement, row: number, column: QuoteColumn, caret: 'end' | 'select' | 'as-is'): void => {
    const id = rows[row]?.id;
    if (id === undefined) return;
    useAppStore.getState().endEdit();
    editing.current = { el, rowId: id, column };
    el.dataset.editing = 'true';
    if (caret === 'end') el.setSelectionRange(el.value.length, el.value.length);
    else if (caret === 'select') el.select();
  };
  function stopEditing(): void {
    const ed = editing.current;
    if (!ed) return;
    delete ed.el.dataset.editing;
    editing.current = null;
  }
  /** Escape: the cell goes back to its text from before the edit, as if the edit never happened. */
  const cancelEditing = (): void => {
    const ed = editing.current;
    if (!ed) return;
    useAppStore.getState().cancelEdit(`cell:${ed.rowId}:${ed.column}`);
    stopEditing();
    // The store's text is back in the input after React's commit; select it as a focused cell's.
    requestAnimationFrame(() => {
      if (document.activeElement === ed.el && editing.current === null) ed.el.select();
    });
  };
  const onMouseDown = (e: MouseEvent<HTMLTableElement>): void => {
    // A click in a cell edits it where clicked (the caret the browser places), as a text field does.
    const el = e.target as HTMLInputElement;
    if (el.tagName !== 'INPUT' || el.dataset.col === undefined || editing.current?.el === el) return;
    startEditing(el, Number(el.dataset.row), el.dataset.col as QuoteColumn, 'as-is');
  };

  const inCurve = new Set<number>();
  if (result.build.curve) for (const p of result.build.curve.pillars) inCurve.add(result.conversion.rowOfQuote[p.quote] ?? -1);

  const onPaste = useCallback((e: ClipboardEvent<HTMLElement>) => {
    const text = e.clipboardData.getData('text/plain');
    const table = looksLikeTable(text);
    const store = useAppStore.getState();
    const tooBig = pasteSizeRefusal(text.length, table);
    if (tooBig) {
      e.preventDefault();
      store.refusePaste(tooBig);
      return;
    }
    if (!table) return;
    e.preventDefault();
    const el = e.target as HTMLElement;
    const row = el.dataset?.row;
    const col = el.dataset?.col as QuoteColumn | undefined;
    const target = row !== undefined && col ? { row: Number(row), column: col } : null;
    cancelReading.current?.();
    const ws = store.workspace;
    if (text.length >= WORKER_FROM_CHARS) store.setPasteProgress({ chars: text.length, rows: null });
    // The paste reader (splitting, header mapping, the preview) is fetched on the first paste, its
    // own chunk, so the first load carries none of it; later pastes find it loaded.
    let cancelled = false;
    let cancelInner: (() => void) | null = null;
    cancelReading.current = () => {
      cancelled = true;
      cancelInner?.();
    };
    void import('./pasteReader.ts').then(({ readPaste }) => {
      if (cancelled) return;
      cancelInner = readPaste(
        { text, mode: ws.quoteUnit, existing: ws.quotes.length, conventions: { dateOrder: ws.display.dateOrder, decimalMark: ws.display.decimalMark } },
        (done) => {
          cancelReading.current = null;
          const s = useAppStore.getState();
          if (done.refusal) s.refusePaste(done.refusal);
          else s.receivePastedBlock(done.block, target, done.preview, done.dropped);
        },
        (rows) => useAppStore.getState().setPasteProgress({ chars: text.length, rows }),
      );
    });
  }, []);

  /**
   * The sheet's keyboard model (as a spreadsheet's): a focused cell is not being edited, and the
   * arrow keys (Home and End along the row, Ctrl+Home and Ctrl+End to the first and last row)
   * move between cells; Enter starts editing with the caret at the end, and typing starts editing
   * with the character typed (it replaces the text). While editing, Left, Right, Home and End move
   * the caret; Enter commits and moves down (adding a row below the last), Shift+Enter up, Up and
   * Down commit and move; Escape puts the text back as it was before the edit. Tab and Shift+Tab
   * move across (the browser's own order), and leaving a cell commits it.
   */
  const onKeyDown = (e: KeyboardEvent<HTMLTableElement>): void => {
    const el = e.target as HTMLInputElement;
    if (el.tagName !== 'INPUT' || el.dataset.row === undefined || el.dataset.col === undefined) return;
    const r = Number(el.dataset.row);
    const c = el.dataset.col as QuoteColumn;
    const isEditing = editing.current?.el === el;
    const k = QUOTE_COLUMNS.indexOf(c);
    if (e.altKey || e.metaKey) return;
    switch (e.key) {
      case 'Enter':
        e.preventDefault();
        if (!isEditing && !e.shiftKey) {
          if (!readOnly) startEditing(el, r, c, 'end');
          return;
        }
        if (e.shiftKey) {
          if (r > 0) moveTo(r - 1, c);
        } else if (r + 1 >= rows.length) {
          if (readOnly || full) return;
          addRow(null);
          requestAnimationFrame(() => moveTo(r + 1, c));
        } else moveTo(r + 1, c);
        return;
      case 'Escape':
        if (!isEditing) return;
        e.preventDefault();
        cancelEditing();
        return;
      case 'ArrowDown':
        e.preventDefault();
        if (r + 1 < rows.length) moveTo(r + 1, c);
        return;
      case 'ArrowUp':
        e.preventDefault();
        if (r > 0) moveTo(r - 1, c);
        return;
      case 'ArrowLeft':
      case 'ArrowRight':
        if (isEditing || e.ctrlKey || e.shiftKey) return;
        e.preventDefault();
        {
          const next = QUOTE_COLUMNS[k + (e.key === 'ArrowLeft' ? -1 : 1)];
          if (next) moveTo(r, next);
        }
        return;
      case 'Home':
      case 'End':
        if (isEditing || e.shiftKey) return;
        e.preventDefault();
        if (e.ctrlKey) moveTo(e.key === 'Home' ? 0 : rows.length - 1, c);
        else moveTo(r, e.key === 'Home' ? QUOTE_COLUMNS[0]! : QUOTE_COLUMNS[QUOTE_COLUMNS.length - 1]!);
        return;
      default:
        // Typing on a focused cell starts an edit: its text is selected, so the key replaces it.
        if (!isEditing && !readOnly && typesText(e)) startEditing(el, r, c, 'select');
    }
  };

  const nodes = result.build.curve?.pillars.length ?? 0;
  const leftOut = result.invalidCount;
  // The "rows left out" count is a link: it focuses the first wrong cell of the first such row.
  const goToFirstError = (): void => {
    const row = result.rowIssues.findIndex((issues) => QUOTE_COLUMNS.some((c) => issues[c]?.severity === 'error'));
    if (row < 0) return;
    const column = QUOTE_COLUMNS.find((c) => result.rowIssues[row]![c]?.severity === 'error')!;
    moveTo(row, column);
  };
  return (
    <section className="panel sheet-panel" aria-labelledby="sheet-title">
      <div className="panel-head">
        <h2 id="sheet-title">Quotes</h2>
        <fieldset className="segmented" aria-describedby="unit-help">
          <legend>Unit of bare numbers</legend>
          {QUOTE_UNIT_MODES.map((m) => (
            <label key={m} className={unit === m ? 'on' : ''}>
              <input type="radio" name="quote-unit" value={m} checked={unit === m} onChange={() => setQuoteUnit(m)} />
              {UNIT_TEXT[m]}
            </label>
          ))}
        </fieldset>
        <span id="unit-help" className="sr-only">
          How a rate, yield or coupon typed without % or bp is read. Switching re-writes bare numbers so their values stay the same.
        </span>
        <label className="sheet-setting">
          Dates
          <select value={dateOrder} onChange={(e) => setConventions({ dateOrder: e.target.value as DateOrder })} title="How 11/12/2027 is read; numeric dates in the sheet are re-written to keep their dates">
            {DATE_ORDERS.map((o) => (
              <option key={o} value={o}>
                {DATE_ORDER_LABEL[o]}
              </option>
            ))}
          </select>
        </label>
        <label className="sheet-setting">
          Decimal mark
          <select value={decimalMark} onChange={(e) => setConventions({ decimalMark: e.target.value as DecimalMark })}>
            {DECIMAL_MARKS.map((m) => (
              <option key={m} value={m}>
                {DECIMAL_MARK_LABEL[m]}
              </option>
            ))}
          </select>
        </label>
        <button
          type="button"
          disabled={full || readOnly}
          title={full ? `The sheet holds at most ${LIMITS.quotes} quotes, the most a workspace may hold` : undefined}
          onClick={() => {
            addRow(null);
            requestAnimationFrame(() => moveTo(rows.length, 'kind'));
          }}
        >
          Add row
        </button>
        <button type="button" onClick={sortByMaturity}>
          Sort by maturity
        </button>
      </div>
      <p className="sheet-status" role="status" aria-live="polite">
        <strong>{nodes}</strong> {nodes === 1 ? 'quote' : 'quotes'} in the curve
        {leftOut > 0 && (
          <span className="left-out">
            {' '}
            ·{' '}
            <button type="button" className="linklike left-out-link" onClick={goToFirstError} title="Go to the first row left out">
              <strong>{leftOut}</strong> {leftOut === 1 ? 'row' : 'rows'} left out with errors
            </button>
          </span>
        )}
        {result.disabledCount > 0 && <span> · {result.disabledCount} switched off</span>}
        {result.conversion.blankRows > 0 && <span> · {result.conversion.blankRows} empty</span>}
        {full && <span> · the sheet is full: a workspace holds at most {LIMITS.quotes} quotes</span>}
      </p>
      {result.conversion.notes.map((n) => (
        <p key={n.path} className="notice setting-note" role="status">
          {n.message.charAt(0).toUpperCase() + n.message.slice(1)}.{' '}
          {n.path === 'curve.joinCalendar' && !readOnly && (
            <button type="button" onClick={() => useAppStore.getState().setJoinCalendar(null)}>
              Clear the joined calendar
            </button>
          )}
        </p>
      ))}
      {progress && (
        <div className="notice" role="status">
          Reading the pasted text ({textSizeWords(progress.chars)})
          {progress.rows === null ? '…' : `: ${progress.rows} rows, checking them…`}{' '}
          <button
            type="button"
            className="linklike"
            onClick={() => {
              cancelReading.current?.();
              cancelReading.current = null;
              useAppStore.getState().setPasteProgress(null);
            }}
          >
            Cancel
          </button>
        </div>
      )}
      {pendingPaste && (
        <Suspense fallback={<p className="muted small" role="status">Reading the paste…</p>}>
          <PastePreview />
        </Suspense>
      )}
      {notice && (
        <div className="notice" role="status">
          {notice.mode === 'refused' && <>Nothing was pasted: {notice.message}.</>}
          {notice.mode === 'replaced' && <>Pasted {notice.rows} rows with a header; they replace the sheet.</>}
          {notice.mode === 'appended' && <>Pasted {notice.rows} rows, appended to the sheet.</>}
          {notice.mode === 'filled' && <>Pasted {notice.rows} rows from the focused cell.</>}
          {notice.ignoredColumns.length > 0 && <> Ignored columns: {notice.ignoredColumns.join(', ')}.</>}
          {(notice.leftOut ?? 0) > 0 && <strong className="left-out"> {rowsLeftOutMessage(notice.leftOut ?? 0)}</strong>}
          {(notice.clippedCells ?? 0) > 0 && (
            <strong className="left-out">
              {' '}
              {notice.clippedCells} {notice.clippedCells === 1 ? 'cell was' : 'cells were'} longer than {LIMITS.cell} characters and cut to that length.
            </strong>
          )}{' '}
          {notice.mode === 'replaced' && (
            <button type="button" onClick={appendInstead}>
              Append instead
            </button>
          )}{' '}
          {notice.mode !== 'refused' && (
            <button type="button" onClick={() => useAppStore.getState().undo()}>
              Undo paste
            </button>
          )}{' '}
          <button type="button" className="linklike" onClick={dismissPasteNotice} aria-label="Dismiss paste notice">
            Dismiss
          </button>
        </div>
      )}
      <div className="sheet-scroll" ref={scrollRef}>
        <table
          role="grid"
          aria-label="Quotes"
          aria-describedby="sheet-help"
          className="sheet"
          ref={gridRef}
          onPaste={onPaste}
          onKeyDown={onKeyDown}
          onFocus={onFocus}
          onBlur={onBlur}
          onMouseDown={onMouseDown}
          aria-rowcount={rows.length + 1}
        >
          <colgroup>
            <col className="w-rownum" />
            <col className="w-on" />
            {QUOTE_COLUMNS.map((c) => (
              <col key={c} className={`w-${c}`} />
            ))}
            <col className="w-actions" />
          </colgroup>
          <thead>
            <tr role="row" aria-rowindex={1}>
              <th role="columnheader" scope="col" className="rownum">
                #
              </th>
              <th role="columnheader" scope="col" className="on">
                On
              </th>
              {QUOTE_COLUMNS.map((c) => (
                <th role="columnheader" scope="col" key={c} className={c} title={QUOTE_COLUMN_LABEL[c]}>
                  {HEADER_TEXT[c]}
                  {(c === 'rate' || c === 'coupon') && <span className="unit"> ({UNIT_TEXT[unit]})</span>}
                  
                </th>
              ))}
              <th role="columnheader" scope="col" className="actions">
                <span className="sr-only">Row actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {/* One flat list of keyed children, so a row keeps its DOM (and the focus) when gaps come and go. */}
            {parts.flatMap((part) =>
              part.kind === 'gap'
                ? [
                    <tr key={part.key} className="sheet-gap" aria-hidden="true">
                      <td colSpan={QUOTE_COLUMNS.length + 3} style={{ height: `${part.heightPx}px` }} />
                    </tr>,
                  ]
                : rows.slice(part.from, part.to).map((row, k) => {
                    const i = part.from + k;
                    return <QuoteRowView key={row.id} row={row} index={i} issues={result.rowIssues[i] ?? {}} unit={unit} selected={row.id === selectedRowId} inCurve={inCurve.has(i)} market={market} noteOf={noteOf} />;
                  }),
            )}
          </tbody>
        </table>
      </div>
      <p id="sheet-help" className="help">
        Arrow keys move between cells; Enter or typing edits a cell, Enter again commits and moves down, Escape takes the edit back. Paste rows from a spreadsheet or CSV onto any cell. A header row (kind or type, maturity or tenor, rate or yield, price or px, coupon or cpn, frequency, day count) shows
        how each column is read before you replace or append to the sheet; rows without a header fill from the focused cell. Rates as 3.25%, 325bp or a bare number in the chosen unit; maturities as 6M, 10Y, 2031-11-15, 15-Nov-2031 or a numeric date in the chosen order; prices per 100 (99.875 or 99-28).
      </p>
    </section>
  );
}

