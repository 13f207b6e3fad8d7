import { couponTag, formatNumber, formatPercent, rateTag } from '../../core/index.ts';
import { useMemo } from 'react';
import type { Curve } from '../../core/index.ts';
import { useAppStore } from '../../state/store.ts';
import { keyMaturityRows } from './keyMaturities.ts';

export function KeyMaturitiesTable({ curve }: { curve: Curve }) {
  const display = useAppStore((s) => s.workspace.display);
  const rows = useMemo(() => keyMaturityRows(curve, display), [curve, display]);
  const tag = rateTag(display.compounding, display.dayCount);
  const anyExtrapolated = rows.some((r) => r.extrapolated);
  return (
    <table className="data" aria-label="Key maturities">
      <caption>
        Key maturities from settlement {curve.settlement}; zero and forward rates <span className="tag">{tag}</span>, par yields{' '}
        <span className="tag">{couponTag(display.parFrequency, 'ACT/ACT-ICMA')}</span>
      </caption>
      <thead>
        <tr>
          <th scope="col">Tenor</th>
          <th scope="col">Date</th>
          <th scope="col">
            t (years) <span className="tag">{curve.dayCount}</span>
          </th>
          <th scope="col">Discount factor</th>
          <th scope="col">
            Zero rate <span className="tag">{tag}</span>
          </th>
          <th scope="col">
            Par yield <span className="tag">{couponTag(display.parFrequency, 'ACT/ACT-ICMA')}</span>
          </th>
          <th scope="col">
            {display.forwardTenor} forward starting then <span className="tag">{tag}</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.tenor} data-tenor={r.tenor} title={r.note ?? undefined}>
            <th scope="row">{r.tenor}</th>
            <td>{r.date}</td>
            <td className="n">{formatNumber(r.t, 4)}</td>
            <td className="n" data-field="discount">{formatNumber(r.discount, 8)}</td>
            <td className="n" data-field="zero">{formatPercent(r.zero)}</td>
            <td className="n" data-field="par">{formatPercent(r.par)}</td>
            <td className={`n${r.extrapolated ? ' extrapolated' : ''}`} data-field="forward">
              {formatPercent(r.forward)}
              {r.extrapolated ? '*' : ''}
            </td>
          </tr>
        ))}
      </tbody>
      {(anyExtrapolated || rows.some((r) => r.note)) && (
        <tfoot>
          <tr>
            <td colSpan={7} className="muted">
              {anyExtrapolated && '* extrapolated past the last pillar (flat forward). '}
              {rows.some((r) => r.note) && '— beyond the last pillar: switch extrapolation to flat forward to read it.'}
            </td>
          </tr>
        </tfoot>
      )}
    </table>
  );
}
