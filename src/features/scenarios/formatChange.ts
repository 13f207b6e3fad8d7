/** Display of a change in basis points with its sign ("+12.50 bp", "−3.00 bp"); an em dash where there is none. */
export const formatBp = (x: number | null | undefined, dp = 2): string => {
  if (x === null || x === undefined || !Number.isFinite(x)) return '\u2014';
  const v = Math.abs(x) < 0.5 * 10 ** -dp ? 0 : x;
  return `${v > 0 ? '+' : v < 0 ? '\u2212' : ''}${Math.abs(v).toFixed(dp)} bp`;
};

/** A rate in percent with its sign kept ("3.1250%"); an em dash where there is none. */
export const formatPct = (r: number | null | undefined, dp = 4): string =>
  r === null || r === undefined || !Number.isFinite(r) ? '\u2014' : `${r < 0 ? '\u2212' : ''}${Math.abs(100 * r).toFixed(dp)}%`;
