import { EditLock } from '../../components/EditLock.tsx';
import { useMemo } from 'react';
import { applyScenario, COMPARISON_TENORS, scenarioEffects, shapeSamples, type EffectConventions, type Scenario } from '../../core/index.ts';
import { validateScenarios } from '../../core/index.ts';
import { rateTag, zeroForwardTag, type BuildOptions, type Curve, type Result, type ScenarioCurve, type Workspace } from '../../core/index.ts';
import { describeShape, SPACE_LABEL } from './describeShape.ts';
import { ScenarioForm } from './ScenarioForm.tsx';
import { ScenarioShapeChart } from './ScenarioShapeChart.tsx';
import { ScenarioTable } from './ScenarioTable.tsx';
import type { DisplaySettings } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import './scenarios.css';

export interface ScenarioPanelProps {
  /** The document's `scenarios` value as stored (validated here). */
  readonly value: unknown;
  /** Writes the document's `scenarios` (for example `setReserved('scenarios', next)`). */
  readonly onChange: (next: Scenario[]) => void;
  /** The validated engine workspace and its base curve (null when there is no curve). */
  readonly workspace: Workspace | null;
  readonly base: Curve | null;
  readonly buildOptions?: BuildOptions;
  readonly conventions: EffectConventions;
  readonly tenors?: readonly string[];
  /** The workbench's build (the base curve's) and display: with them each change in the table opens its explanation. */
  readonly explainFrom?: { readonly result: WorkbenchBuild; readonly display: DisplaySettings };
  /** How scenario i moves the base (by default applyScenario on `workspace` and `base`; the workbench's applyToShown for a named curve). */
  readonly apply?: (s: Scenario, i: number) => Result<ScenarioCurve>;
}

export const effectConventionsText = (c: EffectConventions): string => zeroForwardTag(c);

/** Scenarios: the list with each shape beside its effect on forwards, a form to add one, and the table of changes. */
export function ScenarioPanel({ value, onChange, workspace, base, buildOptions = {}, conventions, tenors = COMPARISON_TENORS, explainFrom, apply }: ScenarioPanelProps) {
  const { scenarios, errors } = useMemo(() => validateScenarios(value), [value]);
  const applied = useMemo(
    () =>
      scenarios.map((s, i) => {
        if (!workspace || !base) return { s, result: null, error: 'no base curve' };
        const r = apply ? apply(s, i) : applyScenario(s, workspace, base, buildOptions, `scenarios[${i}]`);
        if (!r.ok) return { s, result: null, error: r.errors[0]?.message ?? 'no curve' };
        const xMax = Math.min(Math.max(base.lastT, 1), 50);
        return {
          s,
          result: {
            rows: scenarioEffects(base, r.value.curve, tenors, conventions),
            samples: shapeSamples(r.value.shift, base, r.value.curve, xMax, 150),
            nodes: [...r.value.shift.nodes.filter((n) => n.role !== 'all'), ...r.value.shift.marks],
          },
          error: null,
        };
      }),
    [scenarios, workspace, base, buildOptions, conventions, tenors, apply],
  );
  const remove = (id: string): void => onChange(scenarios.filter((s) => s.id !== id));
  return (
    <section className="scenario-panel" aria-label="Scenarios">
      {errors.length > 0 && (
        <div className="banner" role="alert">
          Some saved scenarios could not be read and are not shown: {errors.slice(0, 3).map((e) => e.message).join('; ')}
        </div>
      )}
      <EditLock>
      <ScenarioForm usedIds={scenarios.map((s) => s.id)} onAdd={(s) => onChange([...scenarios, s])} disabled={scenarios.length >= 50} />
      </EditLock>
      {scenarios.length === 0 ? (
        <p className="muted">No scenarios yet. Add one above: a parallel shift, a steepener or flattener, a butterfly or key-rate bumps.</p>
      ) : (
        <>
          <EditLock>
          <ul className="scenario-list">
            {applied.map(({ s, result, error }) => (
              <li key={s.id}>
                <div className="scenario-head">
                  <strong>{s.name}</strong> <span className="muted">{describeShape(s.shape)}; moves the {SPACE_LABEL[s.space]}</span>{' '}
                  <button type="button" onClick={() => remove(s.id)} aria-label={`Remove scenario ${s.name}`}>
                    Remove
                  </button>
                </div>
                {error ? <p className="field-error">{error}</p> : result && <ScenarioShapeChart name={s.name} samples={result.samples} nodes={result.nodes} moves={s.space === 'zero' ? `zero rates (${rateTag('continuous', base?.dayCount ?? '')})` : 'each quote in its own convention'} dayCount={base?.dayCount ?? ''} />}
              </li>
            ))}
          </ul>
          </EditLock>
          <ScenarioTable
            tenors={tenors}
            conventions={effectConventionsText(conventions)}
            columns={applied.map(({ s, result, error }) => ({ id: s.id, name: s.name, rows: result?.rows ?? null, scenario: s, ...(error ? { error } : {}) }))}
            {...(explainFrom ? { explain: { ...explainFrom, conventions, buildOptions } } : {})}
          />
        </>
      )}
    </section>
  );
}
