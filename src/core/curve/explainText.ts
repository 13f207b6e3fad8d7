import type { Explanation, ExplainedNode, ExplainedRead } from './explain.ts';

/**
 * An explanation as plain text a colleague can recompute by hand or in a spreadsheet: every
 * number in full precision (the shortest text that reads back as the same double), dates in ISO.
 */

/** A quote behind the number, as the caller words it (its sheet row, kind and maturity). */
export interface ExplainedQuoteLine {
  readonly label: string;
  readonly bpPerBp: number;
}

/** The number under another method. */
export interface ExplainedMethodLine {
  readonly label: string;
  readonly current: boolean;
  readonly value: number | null;
  readonly error: string | null;
}

export interface ExplanationTextExtras {
  /** What the number is (`2Y zero rate`). */
  readonly title: string;
  /** How a quote index reads (`row 3`); default `quote N`. */
  readonly quoteLabel?: (index: number) => string;
  readonly topQuotes?: readonly ExplainedQuoteLine[];
  /** What the sensitivities are of (when not the number itself), or why there are none. */
  readonly topQuotesNote?: string;
  readonly methods?: readonly ExplainedMethodLine[];
}

/** Full precision: the shortest decimal text that reads back as the same double. */
export const fullText = (x: number): string => (Object.is(x, -0) ? '0' : String(x));

const nodeText = (n: ExplainedNode, quoteLabel: (i: number) => string): string =>
  `${n.date} (t = ${fullText(n.t)}, DF = ${fullText(n.discount)}, ln DF = ${fullText(n.lnDiscount)}, ${n.quote === null ? 'valuation date' : quoteLabel(n.quote)})`;

/** How a read came off the curve, in one line. */
export function readHowText(r: ExplainedRead, quoteLabel: (i: number) => string = (i) => `quote ${i}`): string {
  switch (r.how) {
    case 'settlement':
      return 'the valuation date: DF = 1';
    case 'node':
      return `a node of the curve, set by ${r.nodes[0]!.quote === null ? 'the valuation date' : quoteLabel(r.nodes[0]!.quote)}`;
    case 'interpolated':
      return `interpolated (${r.method}) between ${nodeText(r.nodes[0]!, quoteLabel)} and ${nodeText(r.nodes[1]!, quoteLabel)}`;
    case 'extrapolated':
      return `extrapolated past the last node ${nodeText(r.nodes[0]!, quoteLabel)} at the flat instantaneous forward f1 = ${fullText(r.forward!)}`;
    case 'derived':
      return 'read off a curve derived from another curve';
  }
}

export function explanationText(e: Explanation, extras: ExplanationTextExtras): string {
  const q = extras.quoteLabel ?? ((i: number) => `quote ${i}`);
  const c = e.conventions;
  const out: string[] = [];
  out.push(extras.title);
  out.push(`Value: ${fullText(e.value)} (${e.unit})`);
  out.push(`Definition: ${e.formula}`);
  out.push(
    `Conventions: compounding ${c.compounding ?? 'none (a discount factor)'}; day count ${c.dayCount ?? 'none'}${c.frequency === undefined ? '' : `; ${c.frequency} payments a year`}; curve day count ${c.curveDayCount}; interpolation ${c.interpolation}; extrapolation ${c.extrapolation}; business-day rule ${c.businessDay}; calendar ${c.calendar}`,
  );
  out.push('Dates:');
  for (const d of e.dates) out.push(`  ${d.name}: given ${d.given}; unadjusted ${d.unadjusted}; adjusted ${d.adjusted} (${d.rule})`);
  if (e.yearFractions.length > 0) {
    out.push('Year fractions:');
    for (const y of e.yearFractions) out.push(`  ${y.name} = ${fullText(y.value)} years from ${y.from} to ${y.to}; ${y.rule}`);
  }
  out.push('Discount factors read off the curve:');
  for (const r of e.reads) {
    out.push(`  ${r.name} on ${r.date} (t = ${fullText(r.t)}): DF = ${fullText(r.discount)}, ln DF = ${fullText(r.lnDiscount)}; ${readHowText(r, q)}`);
    if (r.how === 'interpolated' || r.how === 'extrapolated') out.push(`    ${r.formula}`);
  }
  out.push('Steps:');
  for (const s of e.steps) out.push(`  ${s.formula} = ${fullText(s.value)} (${s.unit})`);
  if (extras.topQuotes !== undefined || extras.topQuotesNote !== undefined) {
    out.push(`Quotes it depends on most (bp per bp${extras.topQuotesNote ? `; ${extras.topQuotesNote}` : ''}):`);
    for (const t of extras.topQuotes ?? []) out.push(`  ${t.label}: ${fullText(t.bpPerBp)}`);
  }
  if (extras.methods) {
    out.push(`Under each interpolation method (${e.unit}):`);
    for (const m of extras.methods) out.push(`  ${m.label}: ${m.value === null ? `not available (${m.error ?? 'no value'})` : fullText(m.value)}${m.current ? ' (this curve)' : ''}`);
  }
  out.push('An analysis aid, not investment advice: verify figures against official sources.');
  return `${out.join('\n')}\n`;
}
