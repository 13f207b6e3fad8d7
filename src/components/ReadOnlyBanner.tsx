import { useState } from 'react';
import type { UnknownSetting } from '../core/index.ts';
import { useAppStore } from '../state/store.ts';

const FROM: Readonly<Record<string, string>> = { link: 'The link', file: 'The workspace file', saved: 'The workspace saved in this browser' };

const choiceText = (u: UnknownSetting, choice: string): string => (u.unknownName ? 'leave it out' : choice === String(u.fallback) ? `${choice} (this build's default)` : choice);

/**
 * Shown while a document with settings this build does not know is open read-only: each unknown
 * value with its path and what this build supports, and two ways on: keep reading it as it is (or
 * go back to the workspace from before), or make an editable copy after choosing, in full view,
 * what takes each unknown value's place.
 */
export function ReadOnlyBanner() {
  const readOnly = useAppStore((s) => s.readOnly);
  const keptKey = useAppStore((s) => s.storage.keptCopyKey);
  const [choosing, setChoosing] = useState(false);
  const [choices, setChoices] = useState<Record<string, string>>({});
  if (!readOnly) return null;
  const { unknowns, source } = readOnly;
  const chosen = (u: UnknownSetting): string => choices[u.path] ?? String(u.fallback ?? '');
  const make = (): void => {
    const out: Record<string, string | number | boolean> = {};
    for (const u of unknowns) {
      if (u.unknownName) continue;
      const c = chosen(u);
      out[u.path] = c === 'true' ? true : c === 'false' ? false : /^\d+$/.test(c) ? Number(c) : c;
    }
    useAppStore.getState().makeEditableCopy(out);
    setChoosing(false);
    setChoices({});
  };
  return (
    <section className="banner warn read-only-banner" role="region" aria-label="Read-only workspace">
      <p>
        <strong>Read-only.</strong> {FROM[source] ?? 'This workspace'} uses {unknowns.length === 1 ? 'a setting' : `${unknowns.length} settings`} this build does not know.
        It is shown as it is: nothing was put in their place, edits are off and nothing is saved over your own workspace.
        {source === 'saved' && keptKey && <> The saved entry is also kept in this browser under &ldquo;{keptKey}&rdquo;.</>}
      </p>
      <ul>
        {unknowns.map((u) => (
          <li key={u.path} data-unknown={u.path}>
            <code>{u.path}</code>
            {u.unknownName ? <> is a setting this build does not have ({u.value}); it has {u.supported.join(', ')}.</> : <> is {u.value}; this build supports {u.supported.join(', ')}.</>}
          </li>
        ))}
      </ul>
      {choosing ? (
        <form
          className="editable-copy"
          onSubmit={(e) => {
            e.preventDefault();
            make();
          }}
        >
          <p>Choose what takes each unknown value&rsquo;s place in the copy:</p>
          {unknowns.map((u) =>
            u.unknownName ? (
              <p key={u.path}>
                <code>{u.path}</code>: left out of the copy.
              </p>
            ) : (
              <label key={u.path}>
                <code>{u.path}</code> {u.value} becomes{' '}
                <select value={chosen(u)} onChange={(e) => setChoices({ ...choices, [u.path]: e.target.value })}>
                  {u.supported.map((v) => (
                    <option key={v} value={v}>
                      {choiceText(u, v)}
                    </option>
                  ))}
                </select>
              </label>
            ),
          )}
          <button type="submit">Make the editable copy</button>{' '}
          <button type="button" onClick={() => setChoosing(false)}>
            Cancel
          </button>
        </form>
      ) : (
        <p>
          <button type="button" onClick={() => setChoosing(true)}>
            Make an editable copy…
          </button>{' '}
          <button type="button" onClick={() => useAppStore.getState().closeReadOnly()}>
            {source === 'saved' ? 'Close it and open the demo' : 'Close it and go back to my workspace'}
          </button>{' '}
          <span className="muted small">Or keep reading it as it is.</span>
        </p>
      )}
    </section>
  );
}
