// Small workspace documents for the tests, on markets of our own invention: every quote below is
// invented test and demo data, not market data from any source. Tests pick the quotes they need,
// in the order they list them (quote indices in a test follow that order), and workspaceDoc()
// wraps them in a workspace document.

/** One quote of a workspace document, as a test writes it. */
export type Quote = Readonly<Record<string, string | number | boolean>>;

export interface DocOptions {
  readonly settlement?: string;
  readonly dayCount?: string;
  readonly interpolation?: string;
  /** Left out of the document when not given (the engine's default applies). */
  readonly extrapolation?: string;
}

export interface WorkspaceDoc {
  format: 'tenorscope-workspace';
  version: 1;
  settlement: string;
  curve: { dayCount: string; interpolation: string; extrapolation?: string };
  quotes: Quote[];
}

/** Settlement date of the invented 2027 market below. */
export const INVENTED_2027_SETTLEMENT = '2027-03-10';

/**
 * A workspace document with these quotes (each copied, so two documents never share a quote
 * object). Defaults: settlement 2027-03-10 (the invented 2027 market), ACT/365F, monotone-convex,
 * no extrapolation key.
 */
export function workspaceDoc(quotes: readonly Quote[], options: DocOptions = {}): WorkspaceDoc {
  const curve: WorkspaceDoc['curve'] = { dayCount: options.dayCount ?? 'ACT/365F', interpolation: options.interpolation ?? 'monotone-convex' };
  if (options.extrapolation !== undefined) curve.extrapolation = options.extrapolation;
  return {
    format: 'tenorscope-workspace',
    version: 1,
    settlement: options.settlement ?? INVENTED_2027_SETTLEMENT,
    curve,
    quotes: quotes.map((q) => ({ ...q })),
  };
}
