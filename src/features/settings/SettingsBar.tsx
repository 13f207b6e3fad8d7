import { memo, useEffect, useState } from 'react';
import {
  COMPOUNDINGS,
  CONVEXITY_MODELS,
  CONVEXITY_VOLATILITY_MAX,
  MEAN_REVERSION_MAX,
  convexityModelName,
  conventionSet,
  readRate,
  CURVE_DAY_COUNTS,
  MARKET_CONVENTIONS,
  EXTRAPOLATIONS,
  INTERPOLATIONS,
  INTERPOLATORS,
  isIsoDate,
  type Compounding,
  type CurveDayCount,
  type Extrapolation,
  type InterpolationId,
  rateTag,
} from '../../core/index.ts';
import { FORWARD_TENORS, type ForwardTenor, type MaturityAxis } from '../../core/index.ts';
import { useAppStore } from '../../state/store.ts';

const COMPOUNDING_TEXT: Readonly<Record<Compounding, string>> = {
  simple: 'Simple',
  annual: 'Annual',
  semiannual: 'Semiannual',
  quarterly: 'Quarterly',
  monthly: 'Monthly',
  continuous: 'Continuous',
};
const EXTRAPOLATION_TEXT: Readonly<Record<Extrapolation, string>> = { none: 'None (stop at last pillar)', 'flat-forward': 'Flat forward' };

/** An option for a value this build does not know (a read-only document from another build), so the control shows it rather than its first entry. */
function unknownOption(known: readonly (string | number)[], value: unknown) {
  return known.includes(value as never) ? null : (
    <option value={String(value)} disabled>
      {String(value)} (not in this build)
    </option>
  );
}

/**
 * The settlement date as a plain date input. While a year is being typed the browser reports
 * partial years ("0002-03-10"); those stay in the field and only a complete date the engine
 * takes (`isIsoDate`) is applied, so the curve never empties mid-typing and the field never resets.
 * A date set elsewhere (undo, a file) replaces what the field shows.
 */
function SettlementField() {
  const settlement = useAppStore((s) => s.workspace.settlement);
  const setSettlement = useAppStore((s) => s.setSettlement);
  const [draft, setDraft] = useState(isIsoDate(settlement) ? settlement : '');
  useEffect(() => {
    if (isIsoDate(settlement)) setDraft(settlement);
  }, [settlement]);
  const badDate = !isIsoDate(settlement);
  return (
    <input
      type="date"
      value={draft}
      aria-invalid={badDate || undefined}
      onChange={(e) => {
        setDraft(e.target.value);
        if (isIsoDate(e.target.value)) setSettlement(e.target.value);
      }}
      onBlur={() => {
        if (isIsoDate(settlement) && draft !== settlement) setDraft(settlement);
      }}
    />
  );
}

/**
 * The model that fills the futures' convexity adjustments (`curve.futuresConvexity`): none, Ho-Lee
 * (Hull) or Hull-White, with the short rate's volatility in % a year and, for Hull-White, the mean
 * reversion a year. A number field applies what it reads exactly (the core's rate reader) and keeps
 * a partial entry in the field; the engine names any value it refuses.
 */
function ConvexitySetting() {
  const model = useAppStore((s) => s.workspace.curve.futuresConvexity);
  const setModel = useAppStore((s) => s.setFuturesConvexity);
  const id = typeof model?.model === 'string' ? model.model : 'none';
  const vol = typeof model?.volatility === 'number' ? model.volatility : 0.01;
  const a = typeof model?.meanReversion === 'number' ? model.meanReversion : 0.03;
  const apply = (next: string, volatility: number, meanReversion: number) => {
    setModel(next === 'none' ? null : next === 'ho-lee' ? { model: next, volatility } : { model: next, volatility, meanReversion });
  };
  return (
    <>
      <label title="Fills the convexity adjustment (futures rate minus forward rate) of every future row; the quote check shows the model, its inputs and each contract's figure">
        Futures convexity
        <select value={id} onChange={(e) => apply(e.target.value, vol, a)}>
          {unknownOption(['none', ...CONVEXITY_MODELS], id)}
          <option value="none">None (0 bp)</option>
          {CONVEXITY_MODELS.map((m) => (
            <option key={m} value={m}>
              {convexityModelName(m)}
            </option>
          ))}
        </select>
      </label>
      {id !== 'none' && (
        <NumberSetting label="Volatility (% a year)" value={vol} scale="percent" max={CONVEXITY_VOLATILITY_MAX} onValue={(v) => apply(id, v, a)} />
      )}
      {id === 'hull-white' && <NumberSetting label="Mean reversion (a year)" value={a} scale="decimal" max={MEAN_REVERSION_MAX} onValue={(v) => apply(id, vol, v)} />}
    </>
  );
}

/** A number field that applies each complete, exact reading (`readRate`) and keeps what is being typed. */
function NumberSetting({ label, value, scale, max, onValue }: { label: string; value: number; scale: 'percent' | 'decimal'; max: number; onValue: (v: number) => void }) {
  const shown = scale === 'percent' ? readRate(String(value), 'decimal') : null;
  const text = shown && shown.ok ? shown.value.typed.shifted(2).toFixed() : String(value);
  const [draft, setDraft] = useState(text);
  useEffect(() => setDraft(text), [text]);
  const r = readRate(draft, scale);
  // The range a file is checked against (instruments/convexity.ts): a value outside it stays in the field, marked, and is not applied.
  const ok = r.ok && r.value.bare && r.value.rate >= 0 && r.value.rate <= max;
  const range = scale === 'percent' ? `0 to ${max * 100}` : `0 to ${max}`;
  return (
    <label>
      {label}
      <input
        className="narrow"
        inputMode="decimal"
        value={draft}
        aria-invalid={!ok || undefined}
        title={ok ? undefined : `A number from ${range}; the setting keeps its last value until then`}
        onChange={(e) => {
          setDraft(e.target.value);
          const next = readRate(e.target.value, scale);
          if (next.ok && next.value.bare && next.value.rate >= 0 && next.value.rate <= max) onValue(next.value.rate);
        }}
      />
    </label>
  );
}

/** Curve and display settings. One display setting re-expresses every rate on screen; all are off while the document is read-only. */
export const SettingsBar = memo(function SettingsBar() {
  const curve = useAppStore((s) => s.workspace.curve);
  const display = useAppStore((s) => s.workspace.display);
  const readOnly = useAppStore((s) => s.readOnly !== null);
  const badDate = useAppStore((s) => !isIsoDate(s.workspace.settlement));
  const { setCurve, setDisplay } = useAppStore.getState();
  const knownTag = (COMPOUNDINGS as readonly string[]).includes(display.compounding) && (CURVE_DAY_COUNTS as readonly string[]).includes(display.dayCount);
  return (
    <section className="settings" aria-label="Settings">
      <fieldset disabled={readOnly}>
        <legend>Curve</legend>
        <label>
          Settlement
          <SettlementField />
        </label>
        <label>
          Curve day count
          <select value={curve.dayCount} onChange={(e) => setCurve({ dayCount: e.target.value as CurveDayCount })}>
            {unknownOption(CURVE_DAY_COUNTS, curve.dayCount)}
            {CURVE_DAY_COUNTS.map((d) => (
              <option key={d}>{d}</option>
            ))}
          </select>
        </label>
        <label>
          Interpolation
          <select value={curve.interpolation} onChange={(e) => setCurve({ interpolation: e.target.value as InterpolationId })}>
            {unknownOption(INTERPOLATIONS, curve.interpolation)}
            {INTERPOLATIONS.map((m) => (
              <option key={m} value={m}>
                {INTERPOLATORS[m].label}
              </option>
            ))}
          </select>
        </label>
        <label title="Calendar, spot lag, business-day rule, end-of-month rule, payment lag and day counts for the deposit, OIS and FRA rows">
          Market conventions
          <select value={curve.conventions ?? 'none'} onChange={(e) => setCurve({ conventions: e.target.value })}>
            {unknownOption(MARKET_CONVENTIONS, curve.conventions ?? 'none')}
            {MARKET_CONVENTIONS.map((id) => (
              <option key={id} value={id}>
                {id === 'none' ? 'None (unadjusted, from settlement)' : (conventionSet(id)?.title.replace(/: .*/, '') ?? id)}
              </option>
            ))}
          </select>
        </label>
        <ConvexitySetting />
        <label>
          Extrapolation
          <select value={curve.extrapolation} onChange={(e) => setCurve({ extrapolation: e.target.value as Extrapolation })}>
            {unknownOption(EXTRAPOLATIONS, curve.extrapolation)}
            {EXTRAPOLATIONS.map((x) => (
              <option key={x} value={x}>
                {EXTRAPOLATION_TEXT[x]}
              </option>
            ))}
          </select>
        </label>
      </fieldset>
      <fieldset disabled={readOnly}>
        <legend>
          Show rates as <span className="tag">{knownTag ? rateTag(display.compounding, display.dayCount) : `${String(display.compounding)}, ${String(display.dayCount)}`}</span>
        </legend>
        <label>
          Compounding
          <select value={display.compounding} onChange={(e) => setDisplay({ compounding: e.target.value as Compounding })}>
            {unknownOption(COMPOUNDINGS, display.compounding)}
            {COMPOUNDINGS.map((c) => (
              <option key={c} value={c}>
                {COMPOUNDING_TEXT[c]}
              </option>
            ))}
          </select>
        </label>
        <label>
          Rate day count
          <select value={display.dayCount} onChange={(e) => setDisplay({ dayCount: e.target.value as CurveDayCount })}>
            {unknownOption(CURVE_DAY_COUNTS, display.dayCount)}
            {CURVE_DAY_COUNTS.map((d) => (
              <option key={d}>{d}</option>
            ))}
          </select>
        </label>
        <label>
          Forward tenor
          <select value={display.forwardTenor} onChange={(e) => setDisplay({ forwardTenor: e.target.value as ForwardTenor })}>
            {unknownOption(FORWARD_TENORS, display.forwardTenor)}
            {FORWARD_TENORS.map((t) => (
              <option key={t}>{t}</option>
            ))}
          </select>
        </label>
        <label>
          Par coupons
          <select value={display.parFrequency} onChange={(e) => setDisplay({ parFrequency: Number(e.target.value) })}>
            {unknownOption([1, 2, 4, 12], display.parFrequency)}
            <option value={1}>Annual</option>
            <option value={2}>Semiannual</option>
            <option value={4}>Quarterly</option>
            <option value={12}>Monthly</option>
          </select>
        </label>
      </fieldset>
      <fieldset disabled={readOnly}>
        <legend>Charts</legend>
        <label>
          Maturity axis
          <select value={display.axis} onChange={(e) => setDisplay({ axis: e.target.value as MaturityAxis })}>
            {unknownOption(['linear', 'sqrt'], display.axis)}
            <option value="linear">Linear (years)</option>
            <option value="sqrt">Square-root spaced</option>
          </select>
        </label>
        <label className="check">
          <input type="checkbox" checked={display.showPar} onChange={(e) => setDisplay({ showPar: e.target.checked })} />
          Par yields
        </label>
        <label className="check">
          <input type="checkbox" checked={display.showInstantaneous} onChange={(e) => setDisplay({ showInstantaneous: e.target.checked })} />
          Instantaneous forwards
        </label>
        <label className="check">
          <input type="checkbox" checked={display.showMethodOverlay} onChange={(e) => setDisplay({ showMethodOverlay: e.target.checked })} />
          Compare methods
        </label>
      </fieldset>
      {badDate && (
        <p className="field-error" role="alert">
          Settlement must be a calendar date (YYYY-MM-DD, for example 2026-12-15); no curve until it is one.
        </p>
      )}
    </section>
  );
});
