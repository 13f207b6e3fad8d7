import { CURVE_DAY_COUNTS, rateTag } from '../../core/index.ts';
import {
  moneyUnitOf,
  parseCurrencyText,
  parseAmountText,
  parseBpText,
  parseHorizonText,
  parsePercentText,
  PATH_FILLS,
  percentText,
  ROLL_TENORS,
  STRATEGY_FREQUENCIES,
  type PathFill,
  type StrategyInputs,
  type StrategyViewId,
} from '../../core/index.ts';
import { RollField, RollSelect } from './RollField.tsx';

const FREQ_LABEL: Record<number, string> = { 1: 'annual', 2: 'semiannual', 4: 'quarterly', 12: 'monthly' };
const FILL_LABEL: Record<PathFill, string> = { forwards: "today's forwards", constant: 'a constant rate', ramp: 'a ramp', typed: 'rates typed per leg' };

export interface RollInputsProps {
  readonly strategy: StrategyInputs;
  readonly onChange: (next: StrategyInputs) => void;
  readonly views: readonly { readonly id: StrategyViewId; readonly label: string }[];
  /** Analysis errors by path (`strategy.horizon` ...), shown beside their field. */
  readonly errors: Readonly<Record<string, string>>;
  /** The view actually shown (the saved one may name a scenario that is gone). */
  readonly shownView?: StrategyViewId;
}

/** The strategy inputs: money, horizon, roll instrument, term alternatives, the chosen view. */
export function RollInputs({ strategy, onChange, views, errors, shownView }: RollInputsProps) {
  const set = (patch: Partial<StrategyInputs>) => onChange({ ...strategy, ...patch });
  const setPath = (patch: Partial<StrategyInputs['path']>) => onChange({ ...strategy, path: { ...strategy.path, ...patch } });
  const rollTag = `%, ${rateTag('simple', strategy.rollDayCount)}`;
  return (
    <div className="roll-inputs">
      <fieldset>
        <legend>Money and horizon</legend>
        <RollField label="Amount" unit={moneyUnitOf(strategy.currency)} text={strategy.amount} parse={parseAmountText} onCommit={(amount) => set({ amount })} width="9em" error={errors['strategy.amount'] ?? null} />
        <RollField label="Currency" unit="ISO 4217 code, optional" text={strategy.currency} parse={parseCurrencyText} onCommit={(currency) => set({ currency })} width="4em" error={errors['strategy.currency'] ?? null} />
        <RollField label="Horizon" unit="tenor or date" text={strategy.horizon} parse={parseHorizonText} onCommit={(horizon) => set({ horizon })} width="7em" error={errors['strategy.horizon'] ?? null} />
      </fieldset>
      <fieldset>
        <legend>Roll</legend>
        <RollSelect label="Roll tenor" value={strategy.rollTenor} options={ROLL_TENORS.map((t) => ({ value: t, label: t }))} onChange={(rollTenor) => set({ rollTenor })} />
        <RollSelect label="Roll day count" unit="simple rate" value={strategy.rollDayCount} options={CURVE_DAY_COUNTS.map((d) => ({ value: d, label: d }))} onChange={(rollDayCount) => set({ rollDayCount })} />
      </fieldset>
      <fieldset>
        <legend>Term alternatives</legend>
        <RollSelect label="Par bond to horizon" unit="coupons" value={strategy.bondFrequency} options={STRATEGY_FREQUENCIES.map((f) => ({ value: f, label: FREQ_LABEL[f]! }))} onChange={(bondFrequency) => set({ bondFrequency })} />
        <RollField label="Riding bond maturity" unit="tenor or date" text={strategy.ridingMaturity} parse={parseHorizonText} onCommit={(ridingMaturity) => set({ ridingMaturity })} width="7em" error={errors['strategy.ridingMaturity'] ?? null} />
        <RollSelect label="Riding bond" unit="coupons" value={strategy.ridingFrequency} options={STRATEGY_FREQUENCIES.map((f) => ({ value: f, label: FREQ_LABEL[f]! }))} onChange={(ridingFrequency) => set({ ridingFrequency })} />
      </fieldset>
      <fieldset>
        <legend>View</legend>
        <RollSelect label="Chosen view" value={shownView ?? strategy.view} options={views.map((v) => ({ value: v.id, label: v.label }))} onChange={(view) => set({ view })} />
        <RollField label="Parallel shift" unit="bp on the forwards" text={String(strategy.shiftBp)} parse={parseBpText} onCommit={(shiftBp) => set({ shiftBp })} width="5em" />
        <RollSelect label="Your path from" value={strategy.path.fill} options={PATH_FILLS.map((f) => ({ value: f, label: FILL_LABEL[f] }))} onChange={(fill) => setPath({ fill })} />
        {strategy.path.fill === 'constant' ? (
          <RollField label="Constant rate" unit={rollTag} text={percentText(strategy.path.constant)} parse={parsePercentText} onCommit={(constant) => setPath({ constant })} width="5em" />
        ) : null}
        {strategy.path.fill === 'ramp' ? (
          <>
            <RollField label="Ramp from (leg 2)" unit={rollTag} text={percentText(strategy.path.rampFrom)} parse={parsePercentText} onCommit={(rampFrom) => setPath({ rampFrom })} width="5em" />
            <RollField label="to (last leg)" unit={rollTag} text={percentText(strategy.path.rampTo)} parse={parsePercentText} onCommit={(rampTo) => setPath({ rampTo })} width="5em" />
          </>
        ) : null}
      </fieldset>
    </div>
  );
}
