import { formatBpChange, NO_VALUE, type EffectRow } from '../../core/index.ts';

export interface ScenarioTableProps {
  readonly tenors: readonly string[];
  readonly columns: readonly { readonly id: string; readonly name: string; readonly rows: readonly EffectRow[] | null; readonly error?: string }[];
  /** Conventions of the compared rates, for example "zero cont, ACT/365F; forward 3M simple, ACT/360". */
  readonly conventions: string;
}

/** Changes in bp of zero rates and forwards at the key maturities, one pair of columns per scenario. */
export function ScenarioTable({ tenors, columns, conventions }: ScenarioTableProps) {
  return (
    <table className="data scenario-table" aria-label="Scenario changes at key maturities">
      <caption className="small muted">Change in bp against the base curve; {conventions}</caption>
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
                <td key={`${c.id}z`} className="num" data-cell={`${c.id}:${t}:zero`}>{c.error ? NO_VALUE : formatBpChange(r?.zeroBp)}</td>,
                <td key={`${c.id}f`} className="num" data-cell={`${c.id}:${t}:forward`}>{c.error ? NO_VALUE : formatBpChange(r?.forwardBp)}</td>,
              ];
            })}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
