import { useMemo, useState } from 'react';
import { addTenor, forwardOn, forwardParRateOn, parseTenor, type Curve, type DayCount, type Workspace } from '../../core/index.ts';
import { couponTag, pct, rateTag } from '../../components/format.ts';
import { useAppStore } from '../../state/store.ts';

const STARTS = ['1Y', '2Y', '5Y', '10Y'] as const;
const TENORS = ['1Y', '2Y', '5Y', '10Y'] as const;

/** The swap fixed-leg convention of the workspace: its first swap quote's, else annual 30/360 (common practice). */
export function swapConvention(ws: Workspace | null): { frequency: number; dayCount: DayCount; eom: boolean } {
  const swap = ws?.quotes.find((q) => q.kind === 'swap');
  return swap && swap.kind === 'swap' ? { frequency: swap.frequency, dayCount: swap.dayCount, eom: swap.eom } : { frequency: 1, dayCount: '30/360', eom: false };
}

/** Forward-starting par swap rates (start x tenor, as desks read 1y1y, 5y5y), or forward zero rates. */
export function ForwardGridTable({ curve, workspace }: { curve: Curve; workspace: Workspace | null }) {
  const display = useAppStore((s) => s.workspace.display);
  const [mode, setMode] = useState<'par' | 'zero'>('par');
  const conv = swapConvention(workspace);
  const grid = useMemo(
    () =>
      STARTS.map((s) => {
        const start = addTenor(curve.settlement, parseTenor(s)!);
        return TENORS.map((t) => {
          const end = addTenor(start, parseTenor(t)!);
          const r = mode === 'par' ? forwardParRateOn(curve, start, end, conv.frequency, conv.dayCount, conv.eom) : forwardOn(curve, start, end, display.compounding, display.dayCount);
          return r.ok ? { rate: r.value.rate, extrapolated: r.value.extrapolated, note: null } : { rate: null, extrapolated: false, note: r.errors[0]?.message ?? '' };
        });
      }),
    [curve, mode, conv.frequency, conv.dayCount, conv.eom, display],
  );
  const tag = mode === 'par' ? couponTag(conv.frequency, conv.dayCount) : rateTag(display.compounding, display.dayCount);
  return (
    <div>
      <fieldset className="segmented">
        <legend>Forward grid shows</legend>
        <label className={mode === 'par' ? 'on' : ''}>
          <input type="radio" name="grid-mode" checked={mode === 'par'} onChange={() => setMode('par')} />
          Forward par swap rates
        </label>
        <label className={mode === 'zero' ? 'on' : ''}>
          <input type="radio" name="grid-mode" checked={mode === 'zero'} onChange={() => setMode('zero')} />
          Forward zero rates
        </label>
      </fieldset>
      <table className="data grid4" aria-label="Forward grid">
        <caption>
          {mode === 'par' ? 'Forward par rates on the swap fixed-leg convention' : 'Forward zero rates'} <span className="tag">{tag}</span>; rows start, columns tenor
        </caption>
        <thead>
          <tr>
            <th scope="col">Start \ tenor</th>
            {TENORS.map((t) => (
              <th scope="col" key={t}>
                {t}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {grid.map((row, i) => (
            <tr key={STARTS[i]}>
              <th scope="row">{STARTS[i]}</th>
              {row.map((c, j) => (
                <td key={TENORS[j]} className="n" title={c.note ?? `${STARTS[i]!.toLowerCase()}${TENORS[j]!.toLowerCase()}`} data-cell={`${STARTS[i]}x${TENORS[j]}`}>
                  {pct(c.rate)}
                  {c.extrapolated ? '*' : ''}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
