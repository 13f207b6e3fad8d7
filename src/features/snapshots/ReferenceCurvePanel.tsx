import { useMemo, useState } from 'react';
import { useReferenceInput } from '../compare/referenceInput.ts';
import { formatBpChange, formatNumber, formatPercent, parseReferenceCsv, QUOTE_UNIT_LABEL, QUOTE_UNIT_MODES, referenceConvention, referenceDifferences, type QuoteUnitMode } from '../../core/index.ts';
import { useAppStore } from '../../state/store.ts';
import { COMPOUNDINGS, CURVE_DAY_COUNTS, type Compounding, type Curve, type CurveDayCount, type DisplaySettings } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import type { ReferenceCell } from './explainDifferenceCell.ts';
import type { DatedCell } from '../tables/explainCell.ts';
import { OpenExplanation, useExplainOpener } from '../tables/explainOpener.tsx';

/** A difference, or our zero rate in the reference's convention (a DatedCell). */
type RefCell = ReferenceCell | DatedCell;
const dateOf = (c: RefCell): string => ('reference' in c ? c.reference.date : c.start);
const sameDate = (a: RefCell, b: RefCell): boolean => 'reference' in a === 'reference' in b && dateOf(a) === dateOf(b);

/**
 * Reference curve: paste or open a CSV of discount factors or zero rates by date from another
 * source and see our curve's difference in bp by date. Held in this page only (not saved); the
 * charts can draw it (comparisons).
 */
export function ReferenceCurvePanel({ curve, explainFrom }: { curve: Curve | null; explainFrom?: { readonly result: WorkbenchBuild; readonly display: DisplaySettings } }) {
  const { text, compounding, dayCount, unit: unitChoice, set } = useReferenceInput();
  const setText = (t: string): void => set({ text: t });
  const setCompounding = (c: Compounding): void => set({ compounding: c });
  const setDayCount = (d: CurveDayCount): void => set({ dayCount: d });
  const setUnit = (u: QuoteUnitMode): void => set({ unit: u });
  const [fileError, setFileError] = useState<string | null>(null);
  // Bare zero rates are read as on the sheet: in the sheet's unit unless chosen here (3.05%, 305bp always carry their own).
  const sheetUnit = useAppStore((s) => s.workspace.quoteUnit);
  const unit = unitChoice ?? sheetUnit;
  const parsed = useMemo(() => (text.trim() === '' ? null : parseReferenceCsv(text, compounding, dayCount, unit)), [text, compounding, dayCount, unit]);
  const rows = parsed?.reference && curve ? referenceDifferences(curve, parsed.reference) : [];
  const opener = useExplainOpener<RefCell>(sameDate);
  const reference = parsed?.reference ?? null;
  // The open difference follows the reference as edited since: it names its row by date.
  const o = opener.open;
  const open: RefCell | null =
    o && reference && rows.some((r) => r.date === dateOf(o) && r.differenceBp !== null) ? ('reference' in o ? { reference: { curve: reference, date: o.reference.date } } : { ...o, compounding: reference.compounding, dayCount: reference.dayCount }) : null;
  /** Our zero rate on `date` in the reference's convention, opening its explanation. */
  const oursCell = (date: string, zero: number | null) => {
    const text = formatPercent(zero);
    if (!explainFrom || !reference || zero === null) return text;
    const cell: DatedCell = { field: 'zero', start: date, compounding: reference.compounding, dayCount: reference.dayCount };
    return opener.button(cell, text, `our zero rate on ${date}`);
  };
  const differenceCell = (date: string, bp: number | null) => {
    const text = formatBpChange(bp);
    if (!explainFrom || !reference || bp === null) return text;
    const cell: ReferenceCell = { reference: { curve: reference, date } };
    return opener.button(cell, text, `the difference from the reference on ${date}`);
  };
  return (
    <section className="reference-panel" aria-label="Reference curve">
      <div className="settings">
        <label>
          Reference CSV (date,discount or date,zero)
          <textarea value={text} onChange={(e) => setText(e.target.value)} rows={4} cols={36} spellCheck={false} placeholder={'date,discount\n2027-11-30,0.9672'} />
        </label>
        <label>
          Open a CSV file
          <input
            type="file"
            accept=".csv,text/csv"
            onChange={(e) => {
              const f = e.target.files?.[0];
              if (!f) return;
              if (f.size > 2_000_000) {
                setFileError(`${f.name} is ${formatNumber(f.size / 1e6, 1)} MB; a reference curve file is at most 2 MB (${2000} rows).`);
                return;
              }
              setFileError(null);
              void f.text().then(setText, () => setFileError(`${f.name} could not be read.`));
            }}
          />
        </label>
        <label>
          Rates in
          <select value={compounding} onChange={(e) => setCompounding(e.target.value as Compounding)}>
            {COMPOUNDINGS.map((c) => (
              <option key={c}>{c}</option>
            ))}
          </select>
        </label>
        <label>
          Bare zero rates in
          <select value={unit} onChange={(e) => setUnit(e.target.value as QuoteUnitMode)}>
            {QUOTE_UNIT_MODES.map((m) => (
              <option key={m} value={m}>
                {QUOTE_UNIT_LABEL[m]}
              </option>
            ))}
          </select>
        </label>
        <label>
          Day count
          <select value={dayCount} onChange={(e) => setDayCount(e.target.value as CurveDayCount)}>
            {CURVE_DAY_COUNTS.map((d) => (
              <option key={d}>{d}</option>
            ))}
          </select>
        </label>
      </div>
      {fileError && (
        <p className="field-error" role="alert">
          {fileError}
        </p>
      )}
      {parsed && parsed.errors.length > 0 && (
        <ul className="field-error" role="alert">
          {parsed.errors.slice(0, 8).map((e, i) => (
            <li key={i}>{e.message}</li>
          ))}
        </ul>
      )}
      {parsed && parsed.warnings.length > 0 && (
        <ul className="field-warning" role="status">
          {parsed.warnings.slice(0, 8).map((w, i) => (
            <li key={i}>Check: {w}</li>
          ))}
          {parsed.warnings.length > 8 && <li>and {parsed.warnings.length - 8} more rows like these</li>}
        </ul>
      )}
      {rows.length > 0 && parsed?.reference && (
        <table className="data" aria-label="Difference from the reference curve">
          <caption className="small muted">
            Zero rates ({referenceConvention(parsed.reference)}); difference = ours − reference, bp{explainFrom ? '. Choose a difference to see how it is made.' : ''}
          </caption>
          <thead>
            <tr>
              <th>Date</th>
              <th>Reference</th>
              <th>Ours</th>
              <th>Difference</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.date}>
                <th scope="row">{r.date}</th>
                <td className="num">{formatPercent(r.referenceZero)}</td>
                <td className="num">{oursCell(r.date, r.zero)}</td>
                <td className="num">{r.note ?? differenceCell(r.date, r.differenceBp)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {explainFrom ? <OpenExplanation result={explainFrom.result} display={explainFrom.display} cell={open} onClose={opener.close} /> : null}
    </section>
  );
}
