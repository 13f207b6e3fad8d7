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
  /** How a quote index reads (`row 3`); default `quote N`. `curve`: the node's curve, when the explanation names one. */
  readonly quoteLabel?: (index: number, curve?: string) => string;
  readonly topQuotes?: readonly ExplainedQuoteLine[];
  /** What the sensitivities are of (when not the number itself), or why there are none. */
  readonly topQuotesNote?: string;
  readonly methods?: readonly ExplainedMethodLine[];
}

/** Full precision: the shortest decimal text that reads back as the same double. */
export const fullText = (x: number): string => (Object.is(x, -0) ? '0' : String(x));

const nodeText = (n: ExplainedNode, quoteLabel: (i: number, curve?: string) => string): string =>
  `${n.date} (t = ${fullText(n.t)}, DF = ${fullText(n.discount)}, ln DF = ${fullText(n.lnDiscount)}, ${n.quote === null ? 'valuation date' : quoteLabel(n.quote, n.curve)})`;

/** How a read came off the curve, in one line. */
function readHowText(r: ExplainedRead, quoteLabel: (i: number, curve?: string) => string = (i) => `quote ${i}`): string {
  switch (r.how) {
    case 'settlement':
      return 'the valuation date: DF = 1';
    case 'node':
      return `a node of the curve, set by ${r.nodes[0]!.quote === null ? 'the valuation date' : quoteLabel(r.nodes[0]!.quote, r.nodes[0]!.curve)}`;
    case 'interpolated':
      return `interpolated (${r.method}) between ${nodeText(r.nodes[0]!, quoteLabel)} and ${nodeText(r.nodes[1]!, quoteLabel)}`;
    case 'extrapolated':
      return `extrapolated past the last node ${nodeText(r.nodes[0]!, quoteLabel)} at f1 = ${fullText(r.forward!)}`;
    case 'derived':
      return 'read off a curve derived from another curve';
  }
}

/** A titled part of an explanation as lines of plain text (the panel lists them; the text joins them). */
export interface ExplanationSection {
  readonly heading: string;
  readonly lines: readonly string[];
}

/**
 * The definition, the inputs, the steps, and with `extras` the quotes behind the number and its
 * value under each method, as lines with every number in full precision.
 */
export function explanationSections(e: Explanation, extras: Omit<ExplanationTextExtras, 'title'> = {}): ExplanationSection[] {
  const q = extras.quoteLabel ?? ((i: number, curve?: string) => `quote ${i}${curve === undefined ? '' : ` of ${curve}`}`);
  const c = e.conventions;
  const inputs: string[] = [];
  for (const d of e.dates) inputs.push(`${d.name}: given ${d.given}; unadjusted ${d.unadjusted}; adjusted ${d.adjusted} (rule: ${d.rule})`);
  for (const y of e.yearFractions) inputs.push(`${y.name} = ${fullText(y.value)} years from ${y.from} to ${y.to}; ${y.rule}`);
  for (const r of e.reads) {
    const how = r.how === 'interpolated' || r.how === 'extrapolated' ? `; ${r.formula}` : '';
    inputs.push(`${r.name} on ${r.date} (t = ${fullText(r.t)}): DF = ${fullText(r.discount)}, ln DF = ${fullText(r.lnDiscount)}; ${readHowText(r, q)}${how}`);
  }
  const out: ExplanationSection[] = [
    {
      heading: 'Definition',
      lines: [
        e.formula,
        `Compounding ${c.compounding ?? 'none'}; day count ${c.dayCount ?? 'none'}${c.frequency === undefined ? '' : `; ${c.frequency} payments a year`}; curve day count ${c.curveDayCount}; interpolation ${c.interpolation}; extrapolation ${c.extrapolation}; business-day rule ${c.businessDay}; calendar ${c.calendar}`,
      ],
    },
    { heading: 'Inputs', lines: inputs },
    { heading: 'Steps', lines: e.steps.map((s) => `${s.formula} = ${s.text ?? fullText(s.value)} (${s.unit})`) },
  ];
  if (extras.topQuotes !== undefined || extras.topQuotesNote !== undefined) {
    out.push({ heading: `Quotes it depends on most (bp per bp${extras.topQuotesNote ? `; ${extras.topQuotesNote}` : ''})`, lines: (extras.topQuotes ?? []).map((t) => `${t.label}: ${fullText(t.bpPerBp)}`) });
  }
  if (extras.methods) {
    out.push({
      heading: `Under each interpolation method (${e.unit})`,
      lines: extras.methods.map((m) => `${m.label}: ${m.value === null ? `not available (${m.error ?? 'no value'})` : fullText(m.value)}${m.current ? ' (this curve)' : ''}`),
    });
  }
  return out;
}

export function explanationText(e: Explanation, extras: ExplanationTextExtras): string {
  const out: string[] = [extras.title, `Value: ${e.valueText ?? fullText(e.value)} (${e.unit})`];
  for (const s of explanationSections(e, extras)) out.push(`${s.heading}:`, ...s.lines.map((l) => `  ${l}`));
  out.push('An analysis aid, not investment advice: verify figures against official sources.');
  return `${out.join('\n')}\n`;
}
