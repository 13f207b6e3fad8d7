/**
 * The workspace's caps: one set for every way in (typing and adding rows, paste, a workspace file,
 * a link, the browser's saved entry, the command line) and every way out (save, file, link), so a
 * workspace the app holds is always one it can reopen. A document read from outside over a cap is
 * refused with a message naming the cap; a paste over the row cap keeps the first rows and says
 * how many were left out (`capRows`). Nothing is cut silently.
 */
import { formatCount } from '../format/quantities.ts';

export const LIMITS = {
  /** Entries of `quotes` (sheet rows), and of each named curve's `quotes`. */
  quotes: 500,
  /** Named curves (`curves`) besides the default one. */
  namedCurves: 8,
  /** Characters of one typed quote cell or row id. */
  cell: 64,
  /** Characters of the settlement text and of a curve or display setting. */
  setting: 40,
  /** Entries of `scenarios`. */
  scenarios: 50,
  /** Characters of `note`. */
  note: 2000,
  /** Entries of `snapshots` (files only; links carry none). */
  snapshots: 20,
  /** Characters of a scenario or snapshot name. */
  name: 80,
  /** Characters of a scenario id. */
  id: 40,
  /** Points of a key-rate scenario. */
  keyRatePoints: 30,
  /** Size of a scenario shift in bp, either sign. */
  bp: 5000,
  /** Keys of `view`, and characters of a text value in it. */
  viewKeys: 40,
  viewText: 400,
  viewList: 60,
  /** JSON characters of `strategy` (validated by its owner; only its size is capped here). */
  strategyJson: 20000,
  /** Dates in one calendar list of a document (`calendars.<id>.add`, `.remove`, `customCalendars.<name>.holidays`): 111 years of a busy calendar hold about 1,700. */
  calendarDates: 5000,
  /** Dates in the workspace's overnight fixings (`fixings`): about twenty years of business days. */
  fixings: 5000,
  /**
   * Nesting depth of any document read from outside (objects and lists inside each other; the
   * document itself is depth 1). The deepest part the workbench writes is a snapshot's quote
   * (depth 5); a deeper structure is refused before anything walks it recursively.
   */
  depth: 16,
} as const;

/** The row cap as a paste sees it: how many of `incoming` rows fit beside `existing` rows. */
export interface RowCap<T> {
  /** The rows kept (the first ones). */
  readonly rows: readonly T[];
  /** How many were left out (0 when all fit). */
  readonly leftOut: number;
}

/** Keeps the first rows that fit under LIMITS.quotes beside `existing` rows already in the sheet. */
export function capRows<T>(incoming: readonly T[], existing = 0): RowCap<T> {
  const room = Math.max(0, LIMITS.quotes - existing);
  return incoming.length <= room ? { rows: incoming, leftOut: 0 } : { rows: incoming.slice(0, room), leftOut: incoming.length - room };
}

/** The message for rows left out at the cap (null when none were). */
export function rowsLeftOutMessage(leftOut: number): string | null {
  if (leftOut <= 0) return null;
  return `${formatCount(leftOut)} ${leftOut === 1 ? 'row was' : 'rows were'} left out: a workspace holds at most ${LIMITS.quotes} quotes, so the first rows were kept.`;
}

/**
 * The nesting depth of a parsed JSON value, counted without recursion (a value nested thousands
 * deep cannot overflow the stack here); stops counting once it passes `stopAt`. Scalars are 0,
 * `{}` and `[]` are 1.
 */
export function nestingDepth(value: unknown, stopAt: number = LIMITS.depth): number {
  let max = 0;
  const stack: { v: unknown; d: number }[] = [{ v: value, d: 1 }];
  while (stack.length > 0) {
    const { v, d } = stack.pop()!;
    if (v === null || typeof v !== 'object') continue;
    if (d > max) max = d;
    if (max > stopAt) return max;
    const children: readonly unknown[] = Array.isArray(v) ? v : Object.values(v as Record<string, unknown>);
    for (const c of children) if (c !== null && typeof c === 'object') stack.push({ v: c, d: d + 1 });
  }
  return max;
}

/** A message when the value nests deeper than LIMITS.depth (null when it does not). */
export function depthProblem(value: unknown, what = 'the document'): string | null {
  return nestingDepth(value) > LIMITS.depth
    ? `${what} nests lists and objects more than ${LIMITS.depth} deep, far deeper than any workspace; it was not read`
    : null;
}
