import {
  formatBpChange,
  formatMoney,
  formatMoneySigned,
  formatNumber,
  formatPercent,
  formatPrice,
  NO_VALUE,
  parsePercentText,
  percentText,
  rateTag,
  RETURN_TAG,
  yieldTag,
  type RollAnalysis,
  type Money,
  type RidingPart,
  type RollFigure,
  type StrategyInputs,
} from '../../core/index.ts';
import { EditLock } from '../../components/EditLock.tsx';
import { RollField } from './RollField.tsx';
import type { RollExplain } from './RollPanel.tsx';

/** The roll legs: dates, year fractions, today's forwards, the chosen view's rates and the money after each leg; the path's fields are locked in a read-only workspace, the figures' explanations are not. */
export function RollLegsTable({ analysis, strategy, onStrategyChange, explain }: { analysis: RollAnalysis; strategy: StrategyInputs; onStrategyChange: (next: StrategyInputs) => void; explain?: RollExplain | undefined }) {
  const tag = rateTag('simple', analysis.rollDayCount);
  const chosen = analysis.views[analysis.chosen]!;
  const path = analysis.views.find((v) => v.id === 'path')!;
  const editing = chosen.id === 'path';
  const setLeg = (k: number, rate: number) => {
    const legs = path.legRates.slice(1).map((r, i) => (i === k - 1 ? rate : r));
    onStrategyChange({ ...strategy, path: { ...strategy.path, fill: 'typed', legs } });
  };
  return (
    <div className="roll-explain-host">
      <div className="roll-scroll">
      <table className="roll-table roll-legs">
        <caption>
          Roll legs of {analysis.rollTenor} to {analysis.horizon}{' '}
          <span className="muted small">
            every rate in % <span className="tag">{tag}</span>, year fractions {analysis.rollDayCount}; leg 1 is bought today at the spot rate; type a rate in
            the &ldquo;Your path&rdquo; column to set your path leg by leg
          </span>
        </caption>
        <thead>
          <tr>
            <th scope="col">Leg</th>
            <th scope="col">Start</th>
            <th scope="col">End</th>
            <th scope="col" className="num">Days</th>
            <th scope="col" className="num">Year fraction</th>
            <th scope="col" className="num">Today&rsquo;s forward (%)</th>
            {editing ? null : (
              <th scope="col" className="num">
                {chosen.label} (%)
              </th>
            )}
            <th scope="col" className="num">
              Your path (%, type to set)
            </th>
            <th scope="col" className="num">Value after leg ({analysis.moneyUnit})</th>
          </tr>
        </thead>
        <tbody>
          {analysis.legs.map((leg, k) => (
            <tr key={leg.index}>
              <th scope="row">
                {leg.index}
                {leg.short ? <span className="muted small"> short</span> : null}
              </th>
              <td>{leg.start}</td>
              <td>{leg.end}</td>
              <td className="num">{leg.days}</td>
              <td className="num">{formatNumber(leg.tau, 6)}</td>
              <td className="num">{explain ? explain.figure({ kind: 'leg-forward', leg: leg.index }, formatPercent(leg.forward), `today's forward of leg ${leg.index}`) : formatPercent(leg.forward)}</td>
              {editing ? null : <td className="num">{explain ? explain.figure({ kind: 'leg-rate', leg: leg.index }, formatPercent(chosen.legRates[k]!), `rate of leg ${leg.index} under ${chosen.label}`) : formatPercent(chosen.legRates[k]!)}</td>}
              <td className="num">
                {k > 0 ? (
                  <EditLock>
                    <RollField label={`Leg ${leg.index} rate`} text={percentText(path.legRates[k]!, 4)} parse={parsePercentText} onCommit={(r) => setLeg(k, r)} width="6em" />
                  </EditLock>
                ) : (
                  <span title="bought today">{formatPercent(path.legRates[k]!)}</span>
                )}
              </td>
              <td className="num">{explain ? explain.figure({ kind: 'leg-value', leg: leg.index }, formatMoney(analysis.rollValues[k]!), `value after leg ${leg.index}`) : formatMoney(analysis.rollValues[k]!)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      </div>
      {explain?.panel('legs')}
    </div>
  );
}

/** Strategies by views: terminal value, annualised return and the difference against rolling. */
export function RollResultsTable({ analysis, explain }: { analysis: RollAnalysis; explain?: RollExplain | undefined }) {
  const vs = (f: RollFigure, text: string, words: string) => (explain ? explain.figure(f, text, words) : text);
  return (
    <div className="roll-explain-host">
      <div className="roll-scroll">
      <table className="roll-table roll-results">
        <caption>
          Strategies by views, at {analysis.horizon}{' '}
          <span className="muted small">
            value in {analysis.moneyUnit}; return in % <span className="tag">{RETURN_TAG}</span>; against rolling in {analysis.moneyUnit} and bp a year
          </span>
        </caption>
        <thead>
          <tr>
            <th scope="col">Strategy</th>
            {analysis.views.map((v, i) => (
              <th key={v.id} scope="col" className={`num${i === analysis.chosen ? ' chosen' : ''}`} title={v.description}>
                {v.label}
                {i === analysis.chosen ? <span className="muted small"> (chosen)</span> : null}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {analysis.strategies.map((s) => (
            <tr key={s.id}>
              <th scope="row">
                {s.label}
                <span className="roll-detail">{s.detail}</span>
              </th>
              {analysis.views.map((v, i) => {
                const o = v.strategies.find((x) => x.id === s.id)!;
                return (
                  <td key={v.id} className={`num${i === analysis.chosen ? ' chosen' : ''}${v.best === s.id && v.id !== 'forwards' ? ' best' : ''}`}>
                    <span className="roll-value">{explain ? explain.figure({ kind: 'terminal', view: v.id, strategy: s.id }, formatMoney(o.terminal), `money at the horizon of ${s.phrase} under ${v.label}`) : formatMoney(o.terminal)}</span>
                    <span className="roll-sub">{explain ? explain.figure({ kind: 'return', view: v.id, strategy: s.id }, formatPercent(o.annualReturn), `annualised return of ${s.phrase} under ${v.label}`) : formatPercent(o.annualReturn)}</span>
                    {s.id === 'roll' ? null : (
                      <span className="roll-sub">
                        {vs({ kind: 'vs-roll', view: v.id, strategy: s.id }, formatMoneySigned(o.vsRoll), `${s.phrase} against rolling under ${v.label}`)} ·{' '}
                        {vs({ kind: 'vs-roll-bp', view: v.id, strategy: s.id }, formatBpChange(o.vsRollBp), `${s.phrase} against rolling under ${v.label}, bp a year`)}
                      </span>
                    )}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
      </div>
      {explain?.panel('results')}
    </div>
  );
}

/** The riding bond's horizon return split under the chosen view. */
export function RidingSplitTable({ analysis, explain }: { analysis: RollAnalysis; explain?: RollExplain | undefined }) {
  const v = analysis.views[analysis.chosen]!;
  const r = v.riding;
  const rows: [string, RidingPart, Money][] = [
    ['Carry (coupons, their reinvestment, and the price at an unchanged own yield)', 'carry', r.carry],
    ['Roll-down (ageing along today\u2019s curve, unchanged by time to maturity)', 'roll-down', r.rollDown],
    [`Curve change (${v.label} against an unchanged curve)`, 'curve change', r.curveChange],
    ['Total gain over the amount', 'total', r.carry.plus(r.rollDown).plus(r.curveChange)],
  ];
  return (
    <div className="roll-explain-host">
    <table className="roll-table roll-split">
      <caption>
        Riding the {analysis.ridingBond.maturity} bond under {v.label}{' '}
        <span className="muted small">
          in {analysis.moneyUnit}; yield today {formatPercent(analysis.ridingYield)} <span className="tag">{yieldTag(analysis.ridingBond.frequency)}</span>; horizon price {formatPrice(r.horizonPrice)} per 100 face (dirty)
        </span>
      </caption>
      <tbody>
        {rows.map(([k, part, m]) => (
          <tr key={k}>
            <th scope="row">{k}</th>
            <td className="num">{explain ? explain.figure({ kind: 'riding-split', part }, formatMoneySigned(m), `riding split's ${part}`) : formatMoneySigned(m)}</td>
          </tr>
        ))}
      </tbody>
    </table>
    {explain?.panel('split')}
    </div>
  );
}

/** Break-even roll rates, shifts and the riding bond's cushion, and the break-even curve. */
export function BreakEvenTables({ analysis, explain }: { analysis: RollAnalysis; explain?: RollExplain | undefined }) {
  const b = analysis.breakEvens;
  const v = analysis.views[analysis.chosen]!;
  const tag = rateTag('simple', analysis.rollDayCount);
  const showShift = v.id !== 'forwards';
  const label = (id: string) => analysis.strategies.find((s) => s.id === id)?.label ?? id;
  const n = analysis.legs.length;
  const fig = (f: RollFigure, x: number | null, words: string) => (x === null ? NO_VALUE : explain ? explain.figure(f, formatBpChange(x), words) : formatBpChange(x));
  const rise = (against: 'roll' | 'zero') => fig({ kind: 'break-even-rise', against }, b.ridingRiseBp[against], `break-even rise against ${label(against)}`);
  return (
    <div className="roll-breakevens">
      <table className="roll-table">
        <caption>
          Break-evens under {v.label}{' '}
          <span className="muted small">
            r*: constant rate for legs 2{n > 2 ? `\u2013${n}` : ''} (leg 1 at today&rsquo;s spot {formatPercent(analysis.spotRollRate)}), % <span className="tag">{tag}</span>, found by Brent&rsquo;s method
          </span>
        </caption>
        <thead>
          <tr>
            <th scope="col">Rolling against</th>
            <th scope="col" className="num">r* (%, {tag})</th>
            {showShift ? <th scope="col" className="num">Parallel shift of the view (bp on every rate set after today, <span className="tag">{tag}</span>, and on the horizon curve&rsquo;s zero rates, <span className="tag">{rateTag('continuous', analysis.curveDayCount)}</span>)</th> : null}
          </tr>
        </thead>
        <tbody>
          {(['zero', 'bond', 'riding'] as const).map((id) => (
            <tr key={id}>
              <th scope="row">{label(id)}</th>
              <td className="num">
                {b.rollRate[id] === null ? 'none (single leg or no crossing)' : explain ? explain.figure({ kind: 'break-even-rate', against: id }, formatPercent(b.rollRate[id]), `break-even roll rate against ${label(id)}`) : formatPercent(b.rollRate[id])}
              </td>
              {showShift ? (
                <td className="num">
                  {b.shiftBp[id] === null ? 'none' : explain ? explain.figure({ kind: 'break-even-shift', against: id }, formatBpChange(b.shiftBp[id]), `break-even shift of the view against ${label(id)}`) : formatBpChange(b.shiftBp[id])}
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
      {explain?.panel('breakevens')}
      <p className="small">
        Riding the {analysis.ridingBond.maturity} bond: the horizon curve can rise in parallel by{' '}
        <strong>{rise('roll')}</strong> (zero rates, <span className="tag">{rateTag('continuous', analysis.curveDayCount)}</span>) before it falls behind rolling, and by{' '}
        {rise('zero')} before it falls behind the zero to the horizon.
        {b.ridingRiseBp.roll !== null && b.ridingRiseBp.roll < 0 ? ' A negative figure means it is already behind and needs the curve to fall.' : ''}
      </p>
      {b.curve.length > 0 ? (
        <table className="roll-table">
          <caption>
            Break-even curve{' '}
            <span className="muted small">
              for each maturity, the rise in its par bond&rsquo;s yield by {analysis.horizon} that its carry over the zero to the horizon absorbs (coupons reinvested at today&rsquo;s forwards)
            </span>
          </caption>
          <thead>
            <tr>
              <th scope="col">Maturity</th>
              <th scope="col" className="num">Yield today (%, {yieldTag(b.curve[0]!.frequency)})</th>
              <th scope="col" className="num">Break-even rise (bp of that yield)</th>
            </tr>
          </thead>
          <tbody>
            {b.curve.map((p) => (
              <tr key={p.tenor}>
                <th scope="row">
                  {p.tenor} <span className="muted small">{p.maturity}</span>
                </th>
                <td className="num">{explain ? explain.figure({ kind: 'curve-yield', tenor: p.tenor }, formatPercent(p.yield), `yield today of ${p.tenor}`) : formatPercent(p.yield)}</td>
                <td className="num">{p.riseBp === null ? 'none' : fig({ kind: 'curve-rise', tenor: p.tenor }, p.riseBp, `break-even rise of ${p.tenor}`)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {explain?.panel('curve')}
    </div>
  );
}

