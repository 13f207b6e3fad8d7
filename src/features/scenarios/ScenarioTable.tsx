import { useMemo } from 'react';
import { formatBpChange, NO_VALUE, type BuildOptions, type DisplaySettings, type EffectConventions, type EffectField, type EffectRow, type Scenario } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import type { ChangeCell } from '../tables/explainCell.ts';
import { OpenExplanation, useExplainOpener } from '../tables/explainOpener.tsx';

/** What a change needs to explain itself: the build the table's curves come from, as the scenarios were applied. */
export interface ScenarioExplainHost {
  readonly result: WorkbenchBuild;
  readonly display: DisplaySettings;
  readonly conventions: EffectConventions;
  readonly buildOptions: BuildOptions;
}

export interface ScenarioTableProps {
  readonly tenors: readonly string[];
  readonly columns: readonly { readonly id: string; readonly name: string; readonly rows: readonly EffectRow[] | null; readonly error?: string; readonly scenario?: Scenario }[];
  /** Conventions of the compared rates, for example "zero cont, ACT/365F; forward 3M simple, ACT/360". */
  readonly conventions: string;
  /** With it, each change is a button that opens its explanation. */
  readonly explain?: ScenarioExplainHost;
}

const sameChange = (a: ChangeCell, b: ChangeCell): boolean => a.change.scenario.id === b.change.scenario.id && a.change.tenor === b.change.tenor && a.change.field === b.change.field;

/** Changes in bp of zero rates and forwards at the key maturities, one pair of columns per scenario; with `explain`, each change opens its explanation. */
export function ScenarioTable({ tenors, columns, conventions, explain }: ScenarioTableProps) {
  const opener = useExplainOpener<ChangeCell>(sameChange);
  // The open change follows its scenario as edited since (and the table's conventions and build options): the cell names it by id.
  const openColumn = opener.open === null ? undefined : columns.find((c) => c.scenario?.id === opener.open!.change.scenario.id && !c.error);
  const openScenario = openColumn?.scenario;
  const open = useMemo<ChangeCell | null>(
    () => (opener.open !== null && openScenario && explain ? { change: { ...opener.open.change, scenario: openScenario, conventions: explain.conventions, buildOptions: explain.buildOptions } } : null),
    [opener.open, openScenario, explain?.conventions, explain?.buildOptions],
  );
  const figure = (c: ScenarioTableProps['columns'][number], t: string, r: EffectRow | null, field: EffectField) => {
    const bp = field === 'zero' ? r?.zeroBp : r?.forwardBp;
    const text = c.error ? NO_VALUE : formatBpChange(bp);
    if (!explain || c.error || !c.scenario || bp === null || bp === undefined) return text;
    const cell: ChangeCell = { change: { scenario: c.scenario, tenor: t, field, conventions: explain.conventions, buildOptions: explain.buildOptions } };
    const what = field === 'zero' ? 'zero rate' : `${explain.conventions.forwardTenor} forward`;
    return opener.button(cell, text, `the change of the ${t} ${what} under ${c.name}`);
  };
  return (
    <>
      <table className="data scenario-table" aria-label="Scenario changes at key maturities">
        <caption className="small muted">
          Change in bp against the base curve; {conventions}
          {explain ? '. Choose a change to see how it is made.' : ''}
        </caption>
        <thead>
          <tr>
            <th rowSpan={2}>Tenor</th>
            {columns.map((c) => (
              <th key={c.id} colSpan={2} scope="colgroup">
                {c.name}
              </th>
            ))}
          </tr>
          <tr>
            {columns.map((c) => [
              <th key={`${c.id}z`} scope="col">zero</th>,
              <th key={`${c.id}f`} scope="col">forward</th>,
            ])}
          </tr>
        </thead>
        <tbody>
          {tenors.map((t) => (
            <tr key={t}>
              <th scope="row">{t}</th>
              {columns.map((c) => {
                const r = c.rows?.find((x) => x.tenor === t) ?? null;
                return [
                  <td key={`${c.id}z`} className="num" data-cell={`${c.id}:${t}:zero`}>{figure(c, t, r, 'zero')}</td>,
                  <td key={`${c.id}f`} className="num" data-cell={`${c.id}:${t}:forward`}>{figure(c, t, r, 'forward')}</td>,
                ];
              })}
            </tr>
          ))}
        </tbody>
      </table>
      {explain ? <OpenExplanation result={explain.result} display={explain.display} cell={open} onClose={opener.close} /> : null}
    </>
  );
}
