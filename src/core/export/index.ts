/** Ways out: CSV (formula-injection safe), the curve table and the workspace hash. */
export * from './csv.ts';
export * from './hash.ts';
export * from './curveTable.ts';
