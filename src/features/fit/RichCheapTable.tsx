import { bpFigure, formatCoupon, formatPrice } from '../../core/index.ts';
import type { RichCheapEntry } from '../../core/index.ts';
import { rowNumber } from '../../components/format.ts';
import type { ReactNode } from 'react';

/**
 * Bonds against the fitted curve, richest first. Rich: the market price is above the model price
 * (the market yield below the model yield). `figure`, when given, makes a price or yield figure a
 * button that opens its explanation (the residual's is the residual table's).
 */
export function RichCheapTable({ entries, yieldTag, rowOfQuote, figure }: { entries: readonly RichCheapEntry[]; yieldTag: string; rowOfQuote?: readonly number[] | undefined; figure?: (index: number, which: 'richness' | 'residual', text: string) => ReactNode }) {
  const show = (index: number, which: 'richness' | 'residual', text: string): ReactNode => (figure ? figure(index, which, text) : text);
  if (entries.length === 0) return <p className="muted">No bond quotes to rank: rich and cheap apply to bonds.</p>;
  return (
    <div className="table-scroll" tabIndex={0} role="region" aria-label="Rich and cheap bonds (scrolls sideways)">
    <table className="data" aria-label="Rich and cheap bonds">
      <caption>
        Bonds by richness to the fit (market minus model price); yields <span className="tag">{yieldTag}</span>
      </caption>
      <thead>
        <tr>
          <th scope="col">Row</th>
          <th scope="col">Maturity</th>
          <th scope="col">Coupon (% per year)</th>
          <th scope="col">Market minus model (per 100 face)</th>
          <th scope="col">Model minus market yield (bp)</th>
          <th scope="col">Reading</th>
        </tr>
      </thead>
      <tbody>
        {entries.map((e) => (
          <tr key={e.index} data-quote={e.index} className={e.included ? undefined : 'muted'}>
            <th scope="row">Row {rowNumber(rowOfQuote, e.index)}</th>
            <td>{e.maturity}</td>
            <td className="n">{formatCoupon(e.coupon)}</td>
            <td className="n" data-field="richness">{show(e.index, 'richness', formatPrice(e.richnessPrice))}</td>
            <td className="n" data-field="residual-bp">{show(e.index, 'residual', bpFigure(e.residualBp))}</td>
            <td data-field="verdict">
              {e.verdict}
              {e.included ? '' : ' (left out of the fit)'}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
    </div>
  );
}
