import { useMemo, useState, type ReactNode } from 'react';
import {
  analyzeBond,
  DAY_COUNTS,
  DEFAULT_KEY_TENORS,
  parsePriceText,
  quoteDv01s,
  resolveMarketDate,
  type BondInput,
  type Curve,
  type CurveBuild,
  type DayCount,
  couponTag,
  NO_VALUE,
  rateTag,
  formatNumber,
  bpFigure,
  formatPrice,
  formatPercent,
  nearZero,
  BOND_FIGURE_WORDS,
  bondFigureValue,
  type BondFigure,
  type BondSide,
  type ShiftFigure,
} from '../../core/index.ts';
import { rowNumber } from '../../components/format.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { OpenExplanation, useExplainOpener } from '../tables/explainOpener.tsx';
import type { BondCell } from './explainBondCell.ts';

export interface BondAnalyticsPanelProps {
  /** The bootstrapped curve the bond is priced on (null: no curve yet). */
  readonly curve: Curve | null;
  /** The build the curve is (its instruments and settings, turns and steps included), for the DV01 to each input quote (optional). */
  readonly build?: Pick<CurveBuild, 'instruments' | 'settings'> | null;
  /** The bond form's starting values (percent texts as typed). */
  readonly initial?: Partial<BondForm>;
  /** Called with the whole form on every edit, so the workbench can keep what was typed. */
  readonly onFormChange?: (form: BondForm) => void;
  /** The workbench's build: with it, each figure is a button that opens its explanation beside the table. */
  readonly result?: WorkbenchBuild;
}

/** The bond as typed: maturity a date or tenor, coupon and yield in percent, price clean per 100. */
export interface BondForm {
  maturity: string;
  coupon: string;
  frequency: string;
  dayCount: DayCount;
  quoteKind: 'none' | 'price' | 'yield';
  quote: string;
}

const DEFAULT_FORM: BondForm = { maturity: '10Y', coupon: '4', frequency: '2', dayCount: 'ACT/ACT-ICMA', quoteKind: 'none', quote: '' };

/** Reads the form into a bond; a message naming the field when a text is not a number or date. */
function readForm(f: BondForm, settlement: string): BondInput | string {
  const at = resolveMarketDate(settlement, f.maturity.trim());
  if (!at.ok) return `Maturity: type a date YYYY-MM-DD or a tenor such as 10Y, not "${f.maturity}"`;
  const maturity = at.value;
  const coupon = Number(f.coupon);
  if (f.coupon.trim() === '' || !Number.isFinite(coupon)) return `Coupon: type a percent per year such as 4.25, not "${f.coupon}"`;
  const base = { maturity, coupon: coupon / 100, frequency: Number(f.frequency), dayCount: f.dayCount };
  if (f.quoteKind === 'none') return base;
  if (f.quoteKind === 'price') {
    // The sheet's own price reading: decimals or points-32nds (102-05, 99-28+), exact.
    const p = parsePriceText(f.quote);
    return p.ok ? { ...base, cleanPrice: p.value } : `Market clean price: ${p.message}`;
  }
  const q = Number(f.quote);
  if (f.quote.trim() === '' || !Number.isFinite(q)) return `Market yield: type a percent such as 4.10, not "${f.quote}"`;
  return { ...base, yield: q / 100 };
}

/**
 * A bond the user enters, valued on the curve: model prices, yield, durations, convexity, DV01,
 * key-rate durations on a stated grid and bump, z-spread and risk at a market quote when given,
 * and the DV01 to each input quote. Every figure carries its unit.
 */
export function BondAnalyticsPanel({ curve, build: built = null, initial, onFormChange, rowOfQuote, result: build }: BondAnalyticsPanelProps & { readonly rowOfQuote?: readonly number[] }) {
  const [form, setForm] = useState<BondForm>({ ...DEFAULT_FORM, ...initial });
  const set = (patch: Partial<BondForm>): void => {
    const next = { ...form, ...patch };
    setForm(next);
    onFormChange?.(next);
  };
  const input = useMemo(() => (curve ? readForm(form, curve.settlement) : null), [curve, form]);
  const result = useMemo(() => (curve && input && typeof input !== 'string' ? analyzeBond(curve, input) : null), [curve, input]);
  const perQuote = useMemo(() => {
    // The shown curve's own rebuild: its instruments and settings (turns, solved spreads, meeting steps).
    if (!built?.settings || !result || !result.ok) return null;
    return quoteDv01s(built.settings, built.instruments, result.value.flows);
  }, [built, result]);

  const display = useAppStore((st) => st.workspace.display);
  const explain = useExplainOpener<BondCell>((a, b) => JSON.stringify(a) === JSON.stringify(b));
  const bondInput = input && typeof input !== 'string' ? input : null;
  // The open explanation is of the bond in the form: another bond in the form closes it (the table's figures changed).
  const openCell = explain.open && bondInput && explain.isOpen({ bond: { ...explain.open.bond, input: bondInput } }) ? explain.open : null;
  /** A figure, as a button that explains it when the build is at hand. */
  const fig = (figure: BondFigure | ShiftFigure, side: BondSide, text: string, key?: number): ReactNode => {
    if (!build || !bondInput || text === NO_VALUE) return text;
    const cell: BondCell = { bond: { input: bondInput, figure, side, ...(key === undefined ? {} : { key }) } };
    const words = figure === 'effectiveDuration' ? 'effective duration' : figure === 'keyRateDuration' ? `${DEFAULT_KEY_TENORS[key!]} key-rate duration` : BOND_FIGURE_WORDS[figure];
    return explain.button(cell, text, `the ${side === 'market' && figure !== 'accrued' ? 'market ' : ''}${words}`, openCell !== null);
  };
  /** A row of the DV01 to each quote table (quote `index` of the document), as a button that explains it. */
  const dv01To = (index: number, text: string): ReactNode => {
    if (!build || !bondInput) return text;
    const cell: BondCell = { bond: { input: bondInput, figure: 'quoteDv01', side: 'model', key: index } };
    return explain.button(cell, text, `the DV01 to row ${rowNumber(rowOfQuote, index)}`, openCell !== null);
  };
  /** A figure on the curve and at the market, each a button (bondFigureValue: the number the table shows). */
  const pair = (figure: BondFigure, format: (x: number) => string): { model: ReactNode; market: ReactNode | null } => {
    const a = result && result.ok ? result.value : null;
    const text = (side: BondSide): string => format(a ? bondFigureValue(a, figure, side)! : NaN);
    return { model: fig(figure, 'model', text('model')), market: a?.market ? fig(figure, 'market', text('market')) : null };
  };
  const yTag = result && result.ok ? couponTag(result.value.bond.frequency, `ICMA, accrual ${result.value.bond.dayCount}`) : '';
  const zTag = curve ? rateTag('continuous', curve.dayCount) : '';
  return (
    <section className="panel bond-panel" aria-label="Bond on the curve">
      <h2>Bond on the curve</h2>
      <form className="controls" onSubmit={(e) => e.preventDefault()}>
        <label>Maturity (date or tenor) <input value={form.maturity} onChange={(e) => set({ maturity: e.target.value })} /></label>{' '}
        <label>Coupon (% per year) <input inputMode="decimal" size={6} value={form.coupon} onChange={(e) => set({ coupon: e.target.value })} /></label>{' '}
        <label>
          Payments a year{' '}
          <select value={form.frequency} onChange={(e) => set({ frequency: e.target.value })}>
            {['1', '2', '4', '12'].map((f) => <option key={f} value={f}>{f}</option>)}
          </select>
        </label>{' '}
        <label>
          Day count{' '}
          <select value={form.dayCount} onChange={(e) => set({ dayCount: e.target.value as DayCount })}>
            {DAY_COUNTS.map((d) => <option key={d} value={d}>{d}</option>)}
          </select>
        </label>{' '}
        <label>
          Market quote{' '}
          <select value={form.quoteKind} onChange={(e) => set({ quoteKind: e.target.value as BondForm['quoteKind'] })}>
            <option value="none">none</option>
            <option value="price">clean price (per 100 face)</option>
            <option value="yield">yield (%)</option>
          </select>
        </label>{' '}
        {form.quoteKind !== 'none' && (
          <label>{form.quoteKind === 'price' ? 'Clean price (per 100 face)' : 'Yield (%)'} <input inputMode="decimal" size={8} value={form.quote} onChange={(e) => set({ quote: e.target.value })} /></label>
        )}
      </form>
      {!curve && <p role="status">No curve yet: the bond is valued once the quotes build a curve.</p>}
      {typeof input === 'string' && <p role="alert" className="error">{input}</p>}
      {result && !result.ok && <p role="alert" className="error">{result.errors.map((e) => e.message).join('; ')}</p>}
      {result && result.ok && (
        <>
          {build && <p className="muted small">Choose a figure to see how it is made.</p>}
          <div className="key-maturities">
          <table className="data" aria-label="Bond analytics">
            <thead>
              <tr><th scope="col">Figure</th><th scope="col">On the curve</th>{result.value.market && <th scope="col">At the market {result.value.market.given}</th>}<th scope="col">Unit</th></tr>
            </thead>
            <tbody>
              <Row label="Clean price" {...pair('clean', formatPrice)} unit="per 100 face" />
              <Row label="Dirty price" {...pair('dirty', formatPrice)} unit="per 100 face" />
              <Row label="Accrued interest" model={fig('accrued', 'model', formatPrice(result.value.accrued))} market={result.value.market && formatPrice(result.value.accrued)} unit={`per 100 face, ${result.value.bond.dayCount}`} />
              <Row label="Yield to maturity" {...pair('yield', formatPercent)} unit={yTag} />
              <Row label="Modified duration −(1/P) dP/dy" {...pair('modifiedDuration', (x) => formatNumber(x, 4))} unit="years" />
              <Row label="Macaulay duration (1 + y/f) × modified" {...pair('macaulayDuration', (x) => formatNumber(x, 4))} unit="years" />
              <Row label="Convexity (1/P) d²P/dy²" {...pair('convexity', (x) => formatNumber(x, 3))} unit="years²" />
              <Row label="DV01 −dP/dy × 1e−4" {...pair('dv01', (x) => formatNumber(x, 5))} unit="per 100 face per bp of yield" />
              <Row label="Effective duration (parallel zero shift)" model={fig('effectiveDuration', 'model', formatNumber(result.value.effectiveDuration, 4))} market={result.value.market && NO_VALUE} unit={`years, shift of the ${zTag} zero`} />
              {result.value.market && <Row label="Z-spread" model={bpFigure(0)} market={fig('zSpread', 'market', bpFigure(result.value.market.zSpread * 1e4))} unit={`bp, ${zTag}`} />}
            </tbody>
          </table>
          {build && <OpenExplanation result={build} display={display} cell={openCell?.bond.figure === 'keyRateDuration' || openCell?.bond.figure === 'quoteDv01' ? null : openCell} onClose={explain.close} />}
          </div>
          <table className="data" aria-label="Key-rate durations">
            <caption>
              Key-rate durations: tent-shaped shifts of the continuously compounded zero <span className="tag">{zTag}</span> at keys {DEFAULT_KEY_TENORS.join(', ')} (flat before the first and after the last,
              so the tents add up to a parallel shift); central differences at ±{result.value.keyRateBumpBp} bp and ±{result.value.keyRateBumpBp / 2} bp, Richardson-combined. Sum{' '}
              {formatNumber(result.value.keyRateDurations.reduce((s, k) => s + k.duration, 0), 4)} years = effective duration.
            </caption>
            <thead><tr>{result.value.keyRateDurations.map((k) => <th key={k.tenor} scope="col">{k.tenor}</th>)}</tr></thead>
            <tbody><tr>{result.value.keyRateDurations.map((k, i) => <td key={k.tenor} className="n" data-key={k.tenor}>{fig('keyRateDuration', 'model', formatNumber(k.duration, 4), i)}</td>)}</tr></tbody>
            <tfoot><tr><td colSpan={result.value.keyRateDurations.length} className="muted">years per unit of the zero shift</td></tr></tfoot>
          </table>
          {build && openCell?.bond.figure === 'keyRateDuration' && <OpenExplanation result={build} display={display} cell={openCell} onClose={explain.close} />}
          {perQuote && perQuote.ok && (
            <table className="data" aria-label="DV01 to each quote">
              <caption>DV01 to each input quote: each quote moved by ±1 bp through its own yield and the curve rebuilt, turns and steps included (per 100 face per bp)</caption>
              <thead><tr><th scope="col">Row</th><th scope="col">Maturity</th><th scope="col">Moved through</th><th scope="col">DV01 (per 100 face per bp)</th></tr></thead>
              <tbody>
                {perQuote.value.map((q) => (
                  <tr key={q.index} data-quote={q.index}><th scope="row">Row {rowNumber(rowOfQuote, q.index)} {q.kind}</th><td>{q.maturity}</td><td>{q.yieldLabel}</td><td className="n" data-field="quote-dv01" title={nearZero(q.dv01, 5, 'per 100 face per bp').title}>{dv01To(q.index, nearZero(q.dv01, 5, 'per 100 face per bp').text)}</td></tr>
                ))}
              </tbody>
            </table>
          )}
          {build && openCell?.bond.figure === 'quoteDv01' && <OpenExplanation result={build} display={display} cell={openCell} onClose={explain.close} />}
        </>
      )}
    </section>
  );
}

function Row({ label, model, market, unit }: { label: string; model: ReactNode; market: ReactNode | null; unit: string }) {
  return (
    <tr>
      <th scope="row">{label}</th>
      <td className="n">{model}</td>
      {market !== null && <td className="n">{market}</td>}
      <td className="unit">{unit}</td>
    </tr>
  );
}
