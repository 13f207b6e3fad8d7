import { couponTag, formatNumber, formatPercent, rateTag } from '../../core/index.ts';
import { useMemo } from 'react';
import type { Curve } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import type { KeyCell, KeyField } from './explainCell.ts';
import { keyMaturityRows } from './keyMaturities.ts';
import { OpenExplanation, useExplainOpener } from './explainOpener.tsx';

/**
 * The key-maturity table. With the build (`result`), each discount factor and rate is a button
 * that opens its explanation beside the table.
 */
export function KeyMaturitiesTable({ curve, result }: { curve: Curve; result?: WorkbenchBuild }) {
  const display = useAppStore((s) => s.workspace.display);
  const rows = useMemo(() => keyMaturityRows(curve, display), [curve, display]);
  const explain = useExplainOpener<KeyCell>((a, b) => a.tenor === b.tenor && a.field === b.field);
  const tag = rateTag(display.compounding, display.dayCount);
  const anyExtrapolated = rows.some((r) => r.extrapolated);
  /** A figure, as a button that explains it when the build is at hand. */
  const figure = (tenor: string, field: KeyField, words: string, text: string, present: boolean) => {
    if (!result || !present) return text;
    const cell = { tenor, field };
    return explain.button(cell, text, `the ${words}`);
  };
  const table = (
    <table className="data" aria-label="Key maturities">
      <caption>
        Key maturities from settlement {curve.settlement}; zero and forward rates <span className="tag">{tag}</span>, par yields{' '}
        <span className="tag">{couponTag(display.parFrequency, 'ACT/ACT-ICMA')}</span>
        {result ? <span className="muted">. Choose a number to see how it is made.</span> : null}
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
            <td className="n" data-field="discount">{figure(r.tenor, 'discount', `${r.tenor} discount factor`, formatNumber(r.discount, 8), r.discount !== null)}</td>
            <td className="n" data-field="zero">{figure(r.tenor, 'zero', `${r.tenor} zero rate`, formatPercent(r.zero), r.zero !== null)}</td>
            <td className="n" data-field="par">{figure(r.tenor, 'par', `${r.tenor} par yield`, formatPercent(r.par), r.par !== null)}</td>
            <td className={`n${r.extrapolated ? ' extrapolated' : ''}`} data-field="forward">
              {figure(r.tenor, 'forward', `${display.forwardTenor} forward rate starting ${r.tenor}`, formatPercent(r.forward), r.forward !== null)}
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
  if (!result) return table;
  return (
    <div className="key-maturities">
      {table}
      <OpenExplanation result={result} display={display} cell={explain.open} onClose={explain.close} />
    </div>
  );
}
