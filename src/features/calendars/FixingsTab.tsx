import { useState } from 'react';
import { formatCount, formatPercent, LIMITS, readFixingList } from '../../core/index.ts';
import { EditLock } from '../../components/EditLock.tsx';
import { useAppStore } from '../../state/store.ts';
import { ListStatus, notTaken, problemText } from '../../components/pastedList.tsx';

/** Rows of the list shown at once: the latest fixings (the ones a future in its period reads). */
const SHOWN = 15;

/**
 * Fixings: the overnight rates of past business days (SOFR, or whatever rate the futures settle
 * on), pasted as a date and a rate per line. A future whose reference period has begun reads the
 * days it needs from here (its own `fixings` in a file win). The list lives in the workspace
 * document (`fixings`): saved, undone, in the link and the file.
 */
export function FixingsTab() {
  const fixings = useAppStore((s) => s.workspace.fixings);
  const quoteUnit = useAppStore((s) => s.workspace.quoteUnit);
  const dateOrder = useAppStore((s) => s.workspace.display.dateOrder);
  const settlement = useAppStore((s) => s.workspace.settlement);
  const [list, setList] = useState('');
  const [message, setMessage] = useState<string | null>(null);
  const dates = Object.keys(fixings ?? {}).sort();
  const mode = quoteUnit === 'decimal' || quoteUnit === 'bp' ? quoteUnit : 'percent';
  const take = (replace: boolean): void => {
    const r = readFixingList(list, mode, dateOrder, settlement);
    const read = Object.keys(r.fixings).length;
    const skipped = r.problems.map(problemText);
    const next = replace ? r.fixings : { ...(fixings ?? {}), ...r.fixings };
    // The one cap of the document's fixings (LIMITS.fixings), which a file or a link is checked against too.
    if (Object.keys(next).length > LIMITS.fixings) {
      setMessage(`Not taken: the list would hold ${formatCount(Object.keys(next).length)} fixings, more than the ${formatCount(LIMITS.fixings)} a workspace keeps; paste the days the futures in their period need.`);
      return;
    }
    if (read > 0) useAppStore.getState().setFixings(next);
    setMessage(`${formatCount(read)} ${read === 1 ? 'fixing' : 'fixings'} ${replace ? 'now make the list' : 'added or replaced'}${notTaken(skipped)}.`);
    if (skipped.length === 0) setList('');
  };
  const unitWords = mode === 'percent' ? 'in % (3.65)' : mode === 'bp' ? 'in bp (365)' : 'as decimals (0.0365)';
  return (
    <div className="holidays">
      <p className="muted small">
        The overnight rate of each business day before the valuation date ({settlement}), as its administrator publishes it (SOFR for the dollar futures). A future whose reference period has begun compounds or averages these for its past days and reads the rest off the curve. The list is saved with this workspace, undone with Undo, and goes with its link and file.
      </p>
      <p className="small">
        {dates.length === 0 ? 'No fixings in this workspace.' : `${formatCount(dates.length)} ${dates.length === 1 ? 'fixing' : 'fixings'}, ${dates[0]} to ${dates[dates.length - 1]}.`}
      </p>
      {dates.length > 0 && (
        <div className="table-scroll">
          <table className="data" aria-label="Overnight fixings, latest first">
            <thead>
              <tr>
                <th scope="col">Date</th>
                <th scope="col">
                  Rate <span className="tag">simple, the rate&rsquo;s own day count</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {dates
                .slice(-SHOWN)
                .reverse()
                .map((d) => (
                  <tr key={d}>
                    <td>{d}</td>
                    <td className="num">{formatPercent(fixings![d]!)}</td>
                  </tr>
                ))}
            </tbody>
          </table>
          {dates.length > SHOWN && <p className="muted small">The latest {SHOWN} of {formatCount(dates.length)} are shown.</p>}
        </div>
      )}
      <EditLock>
        <div className="holidays-add">
          <label>
            Paste fixings: a date and a rate {unitWords} per line
            <textarea rows={5} value={list} onChange={(e) => setList(e.target.value)} placeholder={'2027-03-15\t3.65\n2027-03-16\t3.66'} />
          </label>
          <div className="row-buttons">
            <button type="button" disabled={list.trim() === ''} onClick={() => take(false)}>
              Add to the list
            </button>
            <button type="button" disabled={list.trim() === ''} onClick={() => take(true)}>
              Replace the list
            </button>
            <button type="button" disabled={dates.length === 0} onClick={() => {
              useAppStore.getState().setFixings(null);
              setMessage('The list is empty (Undo brings it back).');
            }}>
              Remove all
            </button>
          </div>
        </div>
      </EditLock>
      <ListStatus message={message} />
    </div>
  );
}
