import { useState } from 'react';
import { BUILT_IN_CALENDARS, calendarYear, closeDay, conventionSet, customCalendarNameProblem, isBuiltInCalendar, openDay, readDateList, type BuiltInCalendarId, type CalendarEdits, type EditOutcome } from '../../core/index.ts';
import { EditLock } from '../../components/EditLock.tsx';
import { useAppStore } from '../../state/store.ts';
import { ListStatus, notTaken, problemText } from '../../components/pastedList.tsx';

/** Calendars a user edits here: the built-in ones that close days (`weekends` has none to open). */
const EDITABLE = BUILT_IN_CALENDARS.filter((id) => id !== 'weekends');


/** The calendar the workspace's market conventions use for its overnight swaps (null when none). */
function marketCalendar(market: string | undefined): BuiltInCalendarId | null {
  const c = market ? conventionSet(market)?.fields.ois?.calendar : undefined;
  return isBuiltInCalendar(c) ? c : null;
}

/**
 * Holidays: the closed weekdays of a built-in calendar for a year, as its publisher's rules make
 * them and as this workspace edits them (a one-off closing added, a holiday opened, a pasted list
 * of closings). The edits live in the workspace document (`calendars`): saved, undone, in the link
 * and the file, and used by every deposit and OIS quote on that calendar.
 */
export function HolidaysTab() {
  const market = useAppStore((s) => s.workspace.curve.conventions);
  const settlement = useAppStore((s) => s.workspace.settlement);
  const allEdits = useAppStore((s) => s.workspace.calendars);
  const dateOrder = useAppStore((s) => s.workspace.display.dateOrder);
  const ofMarket = marketCalendar(market);
  const [chosen, setChosen] = useState<BuiltInCalendarId | null>(null);
  const id: BuiltInCalendarId = chosen ?? ofMarket ?? 'us-gov-securities';
  const [yearText, setYearText] = useState(String(Number(settlement.slice(0, 4)) || 2027));
  const year = Number(yearText);
  const yearOk = Number.isInteger(year) && year >= 1990 && year <= 2100;
  const edits: CalendarEdits = allEdits?.[id] ?? {};
  const view = yearOk ? calendarYear(id, year, edits) : null;
  const [day, setDay] = useState('');
  const [list, setList] = useState('');
  const [message, setMessage] = useState<string | null>(null);
  const apply = (o: EditOutcome, done: string): void => {
    if (!o.ok) {
      setMessage(o.message);
      return;
    }
    useAppStore.getState().setCalendarEdits(id, o.edits);
    setMessage(done);
  };
  const closeList = (): void => {
    const r = readDateList(list, dateOrder);
    let e: CalendarEdits = edits;
    let closed = 0;
    const skipped: string[] = r.problems.map(problemText);
    for (const d of r.dates) {
      const o = closeDay(id, d, e);
      if (o.ok) {
        e = o.edits;
        closed++;
      } else skipped.push(`${d}: ${o.message}`);
    }
    if (closed > 0) useAppStore.getState().setCalendarEdits(id, { add: e.add ?? [], remove: e.remove ?? [] });
    setMessage(`${closed} ${closed === 1 ? 'day' : 'days'} closed on ${id}${notTaken(skipped)}.`);
    if (skipped.length === 0) setList('');
  };
  const changes = (edits.add?.length ?? 0) + (edits.remove?.length ?? 0);
  return (
    <div className="holidays">
      <p className="muted small">
        A calendar decides spot dates, period ends and payment dates of the deposit and OIS rows on a market&rsquo;s conventions
        {ofMarket ? ` (this workspace: ${market}, on ${ofMarket})` : ' (choose Market conventions in the Curve settings for the sheet to use one)'}. Days you close or open here hold for this workspace only: they are saved with it, undone with Undo, and go with its link and file.
      </p>
      <div className="holidays-pick">
        <label>
          Calendar
          <select value={id} onChange={(e) => setChosen(e.target.value as BuiltInCalendarId)}>
            {EDITABLE.map((c) => (
              <option key={c} value={c}>
                {c}
                {c === ofMarket ? ' (the market conventions\u2019)' : ''}
              </option>
            ))}
          </select>
        </label>
        <label>
          Year
          <input type="number" min={1990} max={2100} value={yearText} onChange={(e) => setYearText(e.target.value)} aria-invalid={!yearOk || undefined} />
        </label>
        <span className="muted small">{changes === 0 ? 'No changes of yours on this calendar.' : `${changes} ${changes === 1 ? 'change' : 'changes'} of yours on this calendar (every year).`}</span>
      </div>
      {!yearOk && <p className="error">The year must be from 1990 to 2100.</p>}
      {view && (
        <EditLock>
          <div className="table-scroll">
          <table className="data" aria-label={`Closed weekdays of ${id} in ${year}`}>
            <thead>
              <tr>
                <th scope="col">Date</th>
                <th scope="col">Day</th>
                <th scope="col">Closed by</th>
                <th scope="col">
                  <span className="sr-only">Change</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {view.closed.map((c) => (
                <tr key={c.date}>
                  <td>{c.date}</td>
                  <td>{c.weekday}</td>
                  <td>{c.source === 'published' ? 'the calendar\u2019s rules' : 'you (this workspace)'}</td>
                  <td>
                    <button type="button" aria-label={`Open ${c.date}`} onClick={() => apply(openDay(id, c.date, edits), `${c.date} is open on ${id} in this workspace.`)}>
                      Open
                    </button>
                  </td>
                </tr>
              ))}
              {view.opened.map((d) => (
                <tr key={d} className="muted">
                  <td>{d}</td>
                  <td />
                  <td>opened by you</td>
                  <td>
                    <button type="button" aria-label={`Close ${d} again`} onClick={() => apply(closeDay(id, d, edits), `${d} is closed again on ${id}.`)}>
                      Close again
                    </button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          </div>
          <div className="holidays-add">
            <label>
              Close a day
              <input type="date" value={day} onChange={(e) => setDay(e.target.value)} />
            </label>
            <button type="button" disabled={day === ''} onClick={() => apply(closeDay(id, day, edits), `${day} is closed on ${id} in this workspace.`)}>
              Close this day
            </button>
          </div>
          <details>
            <summary>Close a list of days</summary>
            <label>
              Dates, one per line (YYYY-MM-DD, or as the sheet reads dates)
              <textarea rows={4} value={list} onChange={(e) => setList(e.target.value)} />
            </label>
            <button type="button" disabled={list.trim() === ''} onClick={closeList}>
              Close these days on {id}
            </button>
          </details>
        </EditLock>
      )}
      <ListStatus message={message} />
      <OwnCalendars market={ofMarket} />
    </div>
  );
}

/**
 * Calendars of the workspace's own, each from a pasted list of dates (weekends are Saturday and
 * Sunday), and which of them also closes the market conventions' calendar for the deposit and OIS
 * rows (a day closed on either is closed). Kept in the workspace document (`customCalendars`,
 * `curve.joinCalendar`): saved, undone, in the link and the file.
 */
function OwnCalendars({ market }: { market: BuiltInCalendarId | null }) {
  const own = useAppStore((s) => s.workspace.customCalendars);
  const join = useAppStore((s) => s.workspace.curve.joinCalendar);
  const dateOrder = useAppStore((s) => s.workspace.display.dateOrder);
  const [name, setName] = useState('');
  const [list, setList] = useState('');
  const [message, setMessage] = useState<string | null>(null);
  const names = Object.keys(own ?? {});
  const save = (): void => {
    const problem = customCalendarNameProblem(name.trim());
    if (problem) {
      setMessage(`Not saved: ${problem}.`);
      return;
    }
    const r = readDateList(list, dateOrder);
    if (r.dates.length === 0) {
      setMessage('Not saved: the list has no date (one per line, YYYY-MM-DD or as the sheet reads dates).');
      return;
    }
    useAppStore.getState().setCustomCalendar(name.trim(), r.dates);
    setMessage(`Saved “${name.trim()}” with ${r.dates.length} ${r.dates.length === 1 ? 'day' : 'days'}${notTaken(r.problems.map(problemText))}.`);
    setList('');
  };
  return (
    <section className="own-calendars" aria-label="Calendars of your own">
      <h3>Calendars of your own</h3>
      <EditLock>
        {names.length > 0 && (
          <ul>
            {names.map((n) => (
              <li key={n}>
                {n}: {own![n]!.holidays.length} {own![n]!.holidays.length === 1 ? 'day' : 'days'}{' '}
                <button type="button" aria-label={`Delete the calendar ${n}`} onClick={() => useAppStore.getState().setCustomCalendar(n, null)}>
                  Delete
                </button>
              </li>
            ))}
          </ul>
        )}
        <label>
          Also close the deposit and OIS rows&rsquo; calendar on
          <select
            value={join ?? ''}
            disabled={market === null || names.length === 0}
            onChange={(e) => useAppStore.getState().setJoinCalendar(e.target.value === '' ? null : e.target.value)}
          >
            <option value="">no calendar of your own</option>
            {names.map((n) => (
              <option key={n} value={n}>
                {n}
              </option>
            ))}
          </select>
        </label>
        {market === null && join === undefined && <p className="muted small">Choose Market conventions in the Curve settings first: the rows then have a calendar to join yours to.</p>}
        {market === null && join !== undefined && (
          <p className="small warning-text" role="status">
            “{join}” is chosen to close the deposit and OIS rows&rsquo; calendar, but no Market conventions are chosen, so it changes nothing. Choose Market conventions in the Curve settings, or{' '}
            <button type="button" onClick={() => useAppStore.getState().setJoinCalendar(null)}>
              clear the joined calendar
            </button>
          </p>
        )}
        <details>
          <summary>Make a calendar from a list of dates</summary>
          <label>
            Name
            <input value={name} onChange={(e) => setName(e.target.value)} placeholder="desk-holidays" />
          </label>
          <label>
            Its holidays, one per line
            <textarea rows={4} value={list} onChange={(e) => setList(e.target.value)} />
          </label>
          <button type="button" disabled={name.trim() === '' || list.trim() === ''} onClick={save}>
            Save this calendar
          </button>
        </details>
      </EditLock>
      <ListStatus message={message} />
    </section>
  );
}
