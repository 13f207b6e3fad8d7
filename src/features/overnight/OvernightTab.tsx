import { useMemo, useState } from 'react';
import {
  formatBpChange,
  formatBpSetting,
  formatPercent,
  meetingStepTable,
  overnightForwardView,
  OVERNIGHT_CONVENTION,
  rateTag,
  readDateList,
  readMeetingSteps,
  readTurnLines,
  readTurns,
  engineTurns,
  formatBp,
  turnSpreads,
  type CoreError,
  type QuoteRow,
  type WorkbenchTurn,
} from '../../core/index.ts';
import { EditLock } from '../../components/EditLock.tsx';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { ListStatus, notTaken, problemText } from '../../components/pastedList.tsx';
import { OvernightChart } from './OvernightChart.tsx';
import type { StepCell, TurnCell } from '../tables/explainCell.ts';
import { OpenExplanation, useExplainOpener } from '../tables/explainOpener.tsx';

const OVERNIGHT_TAG = rateTag(OVERNIGHT_CONVENTION.compounding, OVERNIGHT_CONVENTION.dayCount);
const NO_TURNS: readonly WorkbenchTurn[] = [];
const NO_DATES: readonly string[] = [];

/**
 * The overnight curve: policy effective dates and whether the curve steps on them, turns (an extra
 * overnight spread over named days), the implied step of each meeting, and the one-day forward
 * curve for the next three years. Turns and dates live in the workspace document (`turns`,
 * `meetingSteps`): saved, undone, in the link and the file.
 */
export function OvernightTab({ result }: { result: WorkbenchBuild }) {
  const build = result.build;
  // Without a curve, every error of the build is why (turns, dates, or two quotes in one meeting
  // period); the workbench's own message names sheet rows, so it leads.
  const problems = build.curve === null ? build.errors.filter((e) => e.path.startsWith('turns') || e.path.startsWith('meetingSteps')) : [];
  const fatal = build.curve === null ? result.fatal : null;
  const view = useMemo(() => overnightForwardView(build), [build]);
  const rows = useMemo(() => meetingStepTable(build), [build]);
  const display = useAppStore((s) => s.workspace.display);
  const explain = useExplainOpener<StepCell>((a, b) => a.step === b.step && a.level === b.level);
  return (
    <div className="overnight stack">
      <p className="muted small">
        The curve&rsquo;s one-day forward rates ({OVERNIGHT_TAG}), with the policy effective dates it can step on and the turns that lift single days. An analysis aid, not investment advice: check the dates and spreads against official sources.
      </p>
      <MeetingDates />
      <Turns result={result} />
      {fatal !== null && (
        <div role="alert" className="error">
          <p>No curve: {fatal}</p>
          {problems.length > 1 && (
            <ul>
              {problems.map((e: CoreError, i) => (
                <li key={i}>{e.message}</li>
              ))}
            </ul>
          )}
        </div>
      )}
      {rows.length > 0 && (
        <section aria-label="Meeting steps">
          <h3>Implied step at each meeting</h3>
          <div className="key-maturities">
          <div className="table-scroll">
            <table className="data" aria-label="Implied step at each meeting">
              <thead>
                <tr>
                  <th scope="col">Effective date</th>
                  <th scope="col">Level before, % ({OVERNIGHT_TAG})</th>
                  <th scope="col">Level after, % ({OVERNIGHT_TAG})</th>
                  <th scope="col">Step (bp)</th>
                </tr>
              </thead>
              <tbody>
                {rows.map((r) => (
                  <tr key={r.date}>
                    <td>{r.date}</td>
                    {(['before', 'after'] as const).map((level) => (
                      <td key={level} className="num">
                        {explain.button({ step: r.date, level }, formatPercent(r[level]), `the level ${level} the step on ${r.date}`)}
                      </td>
                    ))}
                    <td className="num">
                      {explain.button({ step: r.date }, formatBpChange(r.stepBp), `the step on ${r.date}`)}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <OpenExplanation result={result} display={display} cell={explain.open} onClose={explain.close} />
          </div>
          <p className="muted small">Levels are the one-day forward on the day before and on the effective date, with turns left out.</p>
        </section>
      )}
      {view && view.points.length > 0 ? (
        <section aria-label="Overnight forward">
          <h3>Overnight forward, next three years</h3>
          <OvernightChart view={view} />
        </section>
      ) : (
        <p className="muted small">No curve to draw the overnight forward from yet.</p>
      )}
    </div>
  );
}

/** The effective dates (a pasted list, one per line) and the switch that steps the curve on them. */
function MeetingDates() {
  const steps = useAppStore((s) => s.workspace.meetingSteps);
  const dateOrder = useAppStore((s) => s.workspace.display.dateOrder);
  const dates = steps?.effectiveDates ?? NO_DATES;
  const on = steps?.on === true;
  const [list, setList] = useState('');
  const [message, setMessage] = useState<string | null>(null);
  const save = (): void => {
    const r = readDateList(list, dateOrder);
    if (r.dates.length === 0) {
      setMessage(`Not saved: the list has no date (one per line, YYYY-MM-DD or as the sheet reads dates)${notTaken(r.problems.map(problemText))}.`);
      return;
    }
    const errors: CoreError[] = [];
    const checked = readMeetingStepsChecked(on, r.dates, errors);
    if (!checked) {
      setMessage(`Not saved: ${errors.map((e) => e.message).join('; ')}.`);
      return;
    }
    useAppStore.getState().setMeetingSteps(checked);
    setMessage(`Saved ${r.dates.length} effective ${r.dates.length === 1 ? 'date' : 'dates'}${notTaken(r.problems.map(problemText))}.`);
    if (r.problems.length === 0) setList('');
  };
  return (
    <section aria-label="Policy effective dates">
      <h3>Policy effective dates</h3>
      <p className="muted small">The day each new policy rate applies (for the Fed, the day after the announcement), not the meeting day. With steps on, the curve has a node on each date inside its quotes&rsquo; range and flat overnight forwards between them (log-linear in discount factors, whatever the curve&rsquo;s method); each period between dates needs exactly one quote ending in it.</p>
      <EditLock>
        <label className="check">
          <input type="checkbox" checked={on} disabled={dates.length === 0} onChange={(e) => useAppStore.getState().setMeetingSteps({ on: e.target.checked, effectiveDates: dates })} /> Step the overnight curve on these dates
        </label>
        <p className="small">{dates.length === 0 ? 'No effective dates yet.' : `${dates.length} ${dates.length === 1 ? 'date' : 'dates'}: ${dates.slice(0, 8).join(', ')}${dates.length > 8 ? ', …' : ''}`}</p>
        <details>
          <summary>{dates.length === 0 ? 'Add effective dates' : 'Replace the effective dates'}</summary>
          <label>
            Effective dates, one per line (YYYY-MM-DD, or as the sheet reads dates)
            <textarea rows={4} value={list} onChange={(e) => setList(e.target.value)} />
          </label>
          <button type="button" disabled={list.trim() === ''} onClick={save}>
            Save these dates
          </button>
          {dates.length > 0 && (
            <button type="button" onClick={() => useAppStore.getState().setMeetingSteps(null)}>
              Remove all dates
            </button>
          )}
        </details>
      </EditLock>
      <ListStatus message={message} />
    </section>
  );
}

/** The dates as the engine reads them (its errors name what is wrong), or null. */
const readMeetingStepsChecked = (on: boolean, dates: readonly string[], errors: CoreError[]) => readMeetingSteps({ on, effectiveDates: dates }, errors) ?? null;

/** The turns as the engine reads them (solved ones on a stand-in quote position per row, so two naming one row are caught); its errors, or none. */
function checkTurns(turns: readonly WorkbenchTurn[], rows: readonly QuoteRow[]): CoreError[] {
  const errors: CoreError[] = [];
  const ids = rows.map((r) => r.id);
  readTurns(engineTurns(turns, ids, ids.map((_, i) => i)), errors);
  return errors;
}

/** Sheet row i in words: "row 3 (deposit 2023-01-17)". */
const rowWords = (r: QuoteRow, i: number): string => `row ${i + 1} (${`${r.kind} ${r.maturity}`.trim()})`;

/** The turns: a table with each one's days and spread (given, or solved from a sheet row), a remove button, and lines to add. */
function Turns({ result }: { result: WorkbenchBuild }) {
  const build = result.build;
  const display = useAppStore((s) => s.workspace.display);
  const explain = useExplainOpener<TurnCell>((a, b) => a.turn === b.turn);
  // The table stays outside the edit lock, so a read-only workspace can still open a solved spread's explanation; its editing controls are locked here.
  const locked = useAppStore((s) => s.readOnly !== null);
  const turns = useAppStore((s) => s.workspace.turns) ?? NO_TURNS;
  const rows = useAppStore((s) => s.workspace.quotes);
  const dateOrder = useAppStore((s) => s.workspace.display.dateOrder);
  const decimalMark = useAppStore((s) => s.workspace.display.decimalMark);
  const [list, setList] = useState('');
  const [message, setMessage] = useState<string | null>(null);
  const spreads = useMemo(() => turnSpreads(build), [build]);
  const add = (): void => {
    const r = readTurnLines(list, dateOrder, decimalMark);
    if (r.turns.length === 0) {
      setMessage(`Not added: no line read as a turn${notTaken(r.problems.map(problemText))}.`);
      return;
    }
    const next = [...turns, ...r.turns];
    const errors = checkTurns(next, rows);
    if (errors.length > 0) {
      // Paths turns[i] of the new ones are the pasted lines' order after the saved turns.
      const named = errors.map((e) => e.message.replace(/turns\[(\d+)\]/g, (_, i: string) => (Number(i) < turns.length ? `saved turn ${Number(i) + 1}` : `pasted turn ${Number(i) - turns.length + 1}`)));
      setMessage(`Not added: ${named.join('; ')}.`);
      return;
    }
    useAppStore.getState().setTurns(next);
    setMessage(`Added ${r.turns.length} ${r.turns.length === 1 ? 'turn' : 'turns'}${notTaken(r.problems.map(problemText))}.`);
    if (r.problems.length === 0) setList('');
  };
  /** Sets how turn i's spread is found: `given` (the spread typed before, kept while it was solved; 0 bp for a turn that never had one), or solved from the sheet row with that id. */
  const setSource = (i: number, source: string): void => {
    const { solveFromRow: _row, ...t } = turns[i]!;
    const next: WorkbenchTurn = source === 'given' ? { spreadBp: 0, ...t } : { ...t, solveFromRow: source };
    useAppStore.getState().setTurns(turns.map((x, k) => (k === i ? next : x)));
  };
  return (
    <section aria-label="Turns">
      <h3>Turns</h3>
      <p className="muted small">A turn adds a spread to the overnight rate of the periods starting on the business days from its first to its last day (a Friday&rsquo;s period runs over the weekend to the next business day); every forward period holding one of those days rises, none else. Business days are the turn&rsquo;s calendar&rsquo;s: the first dated row&rsquo;s, else weekends only. Or solve it from a quote spanning the turn.</p>
      {turns.length > 0 && (
        <div className="table-scroll">
          <table className="data" aria-label="Turns">
            <thead>
              <tr>
                <th scope="col">Name</th>
                <th scope="col">First day</th>
                <th scope="col">Last day</th>
                <th scope="col">Spread set by</th>
                <th scope="col">Spread (bp, {OVERNIGHT_TAG}, on the overnight rate)</th>
                <th scope="col">
                  <span className="sr-only">Remove</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {turns.map((t, i) => {
                // One row sets one turn: the picker offers the rows no other turn is solved from; a
                // document that names one row twice (a file) shows it here, naming the other turn.
                const other = (id: string): WorkbenchTurn | undefined => turns.find((x, k) => k !== i && x.solveFromRow === id);
                const clash = t.solveFromRow === undefined ? undefined : other(t.solveFromRow);
                const at = rows.findIndex((r) => r.id === t.solveFromRow);
                return (
                <tr key={t.name}>
                  <td>{t.name}</td>
                  <td>{t.from}</td>
                  <td>{t.to}</td>
                  <td>
                    <select aria-label={`Spread of the turn ${t.name} set by`} disabled={locked} value={t.solveFromRow ?? 'given'} onChange={(e) => setSource(i, e.target.value)}>
                      <option value="given">you</option>
                      {t.solveFromRow !== undefined && !rows.some((r) => r.id === t.solveFromRow) && <option value={t.solveFromRow}>a removed row</option>}
                      {rows.map((r, k) =>
                        r.id === t.solveFromRow || !other(r.id) ? (
                          <option key={r.id} value={r.id}>
                            {rowWords(r, k)}
                          </option>
                        ) : null,
                      )}
                    </select>
                    {clash && (
                      <p className="field-error" role="alert">
                        {`${at < 0 ? 'A removed row' : `Row ${at + 1}`} also sets the turn ${clash.name}: one row sets one turn.`}
                      </p>
                    )}
                  </td>
                  <td className="num" data-turn-spread={t.name}>
                    {t.solveFromRow === undefined || !spreads.some((x) => x.index === i) ? (
                      t.solveFromRow === undefined ? formatBpSetting(t.spreadBp) : solvedText(undefined)
                    ) : (
                      explain.button({ turn: i }, solvedText(spreads.find((x) => x.index === i)), `the spread of the turn ${t.name}`)
                    )}
                  </td>
                  <td>
                    <button type="button" aria-label={`Remove the turn ${t.name}`} disabled={locked} onClick={() => useAppStore.getState().setTurns(turns.filter((x) => x !== t))}>
                      Remove
                    </button>
                  </td>
                </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
      {explain.open !== null && spreads.some((x) => x.index === explain.open!.turn) ? <OpenExplanation result={result} display={display} cell={explain.open} onClose={explain.close} /> : null}
      <EditLock>
        <details open={turns.length === 0}>
          <summary>Add turns</summary>
          <label>
            One turn per line: first day, last day, spread in bp, name (such as 2027-12-31, 2027-12-31, 10, year end)
            <textarea rows={3} value={list} onChange={(e) => setList(e.target.value)} />
          </label>
          <button type="button" disabled={list.trim() === ''} onClick={add}>
            Add these turns
          </button>
        </details>
      </EditLock>
      <ListStatus message={message} />
    </section>
  );
}

/** A solved turn's spread as the curve was built with it, or why there is none. */
const solvedText = (row: { readonly spreadBp: number } | undefined): string => (row === undefined ? 'no curve' : `${formatBp(row.spreadBp)} (solved)`);
