// Numeric assertions for the calculation tests. Every check names where its expected value comes
// from (a worked example, a published table, a hand calculation), so a failure says what was
// compared with what, by how much it missed, and against which source.
import { assert } from 'vitest';

/** Shortest text that reads back as the same double, so no digits are hidden. */
const show = (x: number): string => (Object.is(x, -0) ? '-0' : String(x));

function checkArgs(name: string, actual: unknown, expected: number, tol: number, source: string): void {
  if (typeof source !== 'string' || source.trim() === '') {
    throw new TypeError(`${name}: name the source of the expected value (got ${JSON.stringify(source)})`);
  }
  if (typeof expected !== 'number' || Number.isNaN(expected)) {
    throw new TypeError(`${name} [${source}]: expected value must be a number, got ${String(expected)}`);
  }
  if (typeof tol !== 'number' || !Number.isFinite(tol) || tol < 0) {
    throw new TypeError(`${name} [${source}]: tolerance must be a finite number >= 0, got ${String(tol)}`);
  }
  if (typeof actual !== 'number') {
    assert.fail(`${name} [${source}]: actual is ${typeof actual} ${String(actual)}, expected the number ${show(expected)}`);
  }
}

/**
 * Passes when |actual - expected| <= tol. Equal infinities pass; NaN never does.
 * @param source where the expected value comes from, shown in the failure message
 */
export function expectClose(actual: number, expected: number, tol: number, source: string): void {
  checkArgs('expectClose', actual, expected, tol, source);
  if (actual === expected) return;
  const delta = actual - expected;
  if (Math.abs(delta) <= tol) return;
  assert.fail(
    `expectClose [${source}]: actual ${show(actual)}, expected ${show(expected)}, ` +
      `delta ${show(delta)}, tolerance ${show(tol)}`,
  );
}

/**
 * Passes when |actual - expected| <= max(relTol * |expected|, absTol). The absolute floor is for
 * expected values at or near zero, where a relative tolerance alone accepts nothing.
 * @param source where the expected value comes from, shown in the failure message
 */
export function expectRelClose(
  actual: number,
  expected: number,
  relTol: number,
  source: string,
  absTol = 0,
): void {
  checkArgs('expectRelClose', actual, expected, relTol, source);
  if (typeof absTol !== 'number' || !Number.isFinite(absTol) || absTol < 0) {
    throw new TypeError(`expectRelClose [${source}]: absTol must be a finite number >= 0, got ${String(absTol)}`);
  }
  if (actual === expected) return;
  const delta = actual - expected;
  if (!Number.isFinite(actual) || !Number.isFinite(expected)) {
    assert.fail(`expectRelClose [${source}]: actual ${show(actual)}, expected ${show(expected)}, delta ${show(delta)}`);
  }
  const allowed = Math.max(relTol * Math.abs(expected), absTol);
  if (Math.abs(delta) <= allowed) return;
  const rel = expected === 0 ? Infinity : Math.abs(delta / expected);
  assert.fail(
    `expectRelClose [${source}]: actual ${show(actual)}, expected ${show(expected)}, ` +
      `delta ${show(delta)}, relative error ${show(rel)}, tolerance ${show(relTol)} relative` +
      (absTol > 0 ? ` (absolute floor ${show(absTol)})` : '') +
      `, allowed |delta| ${show(allowed)}`,
  );
}
