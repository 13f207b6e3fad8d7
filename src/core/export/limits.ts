/**
 * Caps on a workspace document read from a link or a file (untrusted input). A document over a
 * cap is refused with a message naming the cap; nothing is cut silently.
 */
export const LIMITS = {
  /** Entries of `quotes`. */
  quotes: 500,
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
} as const;
