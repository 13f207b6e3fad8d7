import { useId, useState, type FormEvent } from 'react';
import { SCENARIO_KINDS, type Scenario, type ScenarioKind, type ScenarioSpace } from '../../core/index.ts';
import { validateScenarios } from '../../core/index.ts';

const KIND_LABEL: Record<ScenarioKind, string> = { parallel: 'Parallel', twist: 'Steepener / flattener', butterfly: 'Butterfly', 'key-rate': 'Key-rate bumps' };

interface Draft {
  name: string;
  kind: ScenarioKind;
  space: ScenarioSpace;
  bp: string;
  short: string;
  pivot: string;
  long: string;
  belly: string;
  wingsBp: string;
  bellyBp: string;
  points: string;
}
const EMPTY: Draft = { name: '', kind: 'parallel', space: 'zero', bp: '25', short: '2Y', pivot: '5Y', long: '10Y', belly: '5Y', wingsBp: '-5', bellyBp: '10', points: '2Y 10, 5Y 0, 10Y -10' };

const numberOf = (text: string): number | string => {
  const t = text.trim().replace('\u2212', '-');
  return /^[+-]?(\d+\.?\d*|\.\d+)$/.test(t) ? Number(t) : text;
};

/** The scenario a draft describes (numbers left as text when they do not read, so validation names them). */
function fromDraft(d: Draft, id: string): Record<string, unknown> {
  const shape: Record<string, unknown> =
    d.kind === 'parallel'
      ? { kind: 'parallel', bp: numberOf(d.bp) }
      : d.kind === 'twist'
        ? { kind: 'twist', short: d.short.trim().toUpperCase(), pivot: d.pivot.trim().toUpperCase(), long: d.long.trim().toUpperCase(), bp: numberOf(d.bp) }
        : d.kind === 'butterfly'
          ? { kind: 'butterfly', short: d.short.trim().toUpperCase(), belly: d.belly.trim().toUpperCase(), long: d.long.trim().toUpperCase(), wingsBp: numberOf(d.wingsBp), bellyBp: numberOf(d.bellyBp) }
          : {
              kind: 'key-rate',
              points: d.points
                .split(',')
                .map((p) => p.trim())
                .filter((p) => p !== '')
                .map((p) => {
                  const [at = '', bp = ''] = p.split(/\s+/);
                  return { at: at.toUpperCase(), bp: numberOf(bp) };
                }),
            };
  return { id, name: d.name.trim() === '' ? 'Scenario' : d.name.trim(), space: d.space, shape };
}

export interface ScenarioFormProps {
  /** Ids in use, so the new scenario gets a fresh one. */
  readonly usedIds: readonly string[];
  readonly onAdd: (scenario: Scenario) => void;
  readonly disabled?: boolean;
}

/** Form for a new scenario: name, what it moves, its shape and the shape's maturities and bp. */
export function ScenarioForm({ usedIds, onAdd, disabled = false }: ScenarioFormProps) {
  const [d, setD] = useState<Draft>(EMPTY);
  const [errors, setErrors] = useState<string[]>([]);
  const uid = useId();
  const set = (patch: Partial<Draft>): void => setD((x) => ({ ...x, ...patch }));
  const submit = (e: FormEvent): void => {
    e.preventDefault();
    let n = 1;
    while (usedIds.includes(`s${n}`)) n++;
    const { scenarios, errors: errs } = validateScenarios([fromDraft(d, `s${n}`)]);
    if (errs.length > 0 || !scenarios[0]) {
      setErrors(errs.map((x) => x.message.replace(/^scenarios\[0\]\.?/, '')));
      return;
    }
    setErrors([]);
    onAdd(scenarios[0]);
    setD((x) => ({ ...x, name: '' }));
  };
  const field = (key: keyof Draft, label: string, hint: string) => (
    <>
      <label title={hint}>
        {label}
        <input value={d[key]} onChange={(e) => set({ [key]: e.target.value } as Partial<Draft>)} size={6} aria-describedby={`${uid}-${key}`} />
      </label>
      <span id={`${uid}-${key}`} className="sr-only">
        {hint}
      </span>
    </>
  );
  return (
    <form className="scenario-form settings" onSubmit={submit} aria-label="New scenario">
      <label>
        Name
        <input value={d.name} onChange={(e) => set({ name: e.target.value })} maxLength={80} placeholder="Bear steepener" />
      </label>
      <label>
        Shape
        <select value={d.kind} onChange={(e) => set({ kind: e.target.value as ScenarioKind })}>
          {SCENARIO_KINDS.map((k) => (
            <option key={k} value={k}>
              {KIND_LABEL[k]}
            </option>
          ))}
        </select>
      </label>
      <label>
        Moves
        <select value={d.space} onChange={(e) => set({ space: e.target.value as ScenarioSpace })}>
          <option value="zero">the zero curve</option>
          <option value="quotes">the quotes (re-bootstrap)</option>
        </select>
      </label>
      {d.kind === 'parallel' && field('bp', 'Shift (bp)', 'basis points, 25 = 0.25%')}
      {d.kind === 'twist' && (
        <>
          {field('short', 'Short', 'tenor such as 2Y')}
          {field('pivot', 'Pivot', 'tenor where the shift is zero')}
          {field('long', 'Long', 'tenor such as 10Y')}
          {field('bp', 'Spread change (bp)', 'positive steepens, negative flattens')}
        </>
      )}
      {d.kind === 'butterfly' && (
        <>
          {field('short', 'Short wing', 'tenor')}
          {field('belly', 'Belly', 'tenor')}
          {field('long', 'Long wing', 'tenor')}
          {field('wingsBp', 'Wings (bp)', 'basis points')}
          {field('bellyBp', 'Belly (bp)', 'basis points')}
        </>
      )}
      {d.kind === 'key-rate' && (
        <label>
          Maturity and bp, comma separated
          <input value={d.points} onChange={(e) => set({ points: e.target.value })} size={28} />
        </label>
      )}
      <button type="submit" disabled={disabled}>
        Add scenario
      </button>
      {errors.length > 0 && (
        <ul className="field-error" role="alert">
          {errors.map((x, i) => (
            <li key={i}>{x}</li>
          ))}
        </ul>
      )}
    </form>
  );
}
