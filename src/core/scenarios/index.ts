/** Scenarios: shapes, zero-space and quote-space shifts, effects, snapshots and reference curves. */
export * from './scenarios.ts';
