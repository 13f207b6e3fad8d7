/**
 * Errors and warnings are values, never bare exceptions. Every code is from the closed list below
 * (documented in README.md); a message says what is wrong and what would be valid.
 */
export const ERROR_CODES = [
  'invalid-json',
  'schema',
  'range',
  'unknown-identifier',
  'duplicate-pillar',
  'before-settlement',
  'beyond-curve',
  'empty-period',
  'non-positive-discount',
  'no-solution',
  'not-converged',
  'unsupported-version',
] as const;
export type ErrorCode = (typeof ERROR_CODES)[number];

export interface CoreError {
  /** Where in the input: `quotes[3].coupon`, `settlement`, `--at[1]`; '' for the whole input. */
  readonly path: string;
  /** Index of the quote in the document's `quotes` array, or null when no single quote is at fault. */
  readonly quote: number | null;
  readonly code: ErrorCode;
  readonly message: string;
}

export const WARNING_CODES = ['skipped', 'disabled', 'negative-forward', 'extrapolated', 'bill-yield', 'spot-gap', 'not-applied'] as const;
export type WarningCode = (typeof WARNING_CODES)[number];

export interface CoreWarning {
  readonly path: string;
  readonly quote: number | null;
  readonly code: WarningCode;
  readonly message: string;
}

export type Result<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly errors: readonly CoreError[] };

export const ok = <T>(value: T): Result<T> => ({ ok: true, value });
export const fail = <T = never>(...errors: CoreError[]): Result<T> => ({ ok: false, errors });
export const coreError = (code: ErrorCode, path: string, message: string, quote: number | null = null): CoreError => ({
  path,
  quote,
  code,
  message,
});
