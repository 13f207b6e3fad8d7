import { useEffect, useId, useState } from 'react';
import { setFieldDraft, useDrafts } from '../../state/drafts.ts';
import type { TextParse } from '../../core/index.ts';

export interface RollFieldProps<T> {
  readonly label: string;
  /** Unit or convention shown after the label ("%, simple ACT/360"). */
  readonly unit?: string;
  /** The committed value as text. */
  readonly text: string;
  readonly parse: (text: string) => TextParse<T>;
  readonly onCommit: (value: T) => void;
  readonly width?: string;
  /** An error about this field from the analysis (beyond its own parsing). */
  readonly error?: string | null;
  /** Where text typed but not committed is kept across reloads; default `roll:<label>`. */
  readonly draftKey?: string;
}

/**
 * A text input that keeps what the user types. It commits on Enter or when it loses focus, and
 * only when the text parses; otherwise the text stays as typed beside the message saying what
 * would be valid, and the document keeps its last valid value (no work is lost). Text typed but
 * not committed is kept as a draft saved with the workspace (src/state/drafts.ts): after a reload
 * the field shows it again, marked as not applied yet.
 */
export function RollField<T>({ label, unit, text, parse, onCommit, width, error, draftKey }: RollFieldProps<T>) {
  const id = useId();
  const key = draftKey ?? `roll:${label}`;
  const saved = useDrafts((s) => s.drafts[key]);
  const [draft, setDraft] = useState(saved ?? text);
  const [message, setMessage] = useState<string | null>(null);
  useEffect(() => {
    setDraft(useDrafts.getState().drafts[key] ?? text);
    setMessage(null);
  }, [text, key]);
  useEffect(() => {
    // Drafts replaced from outside (another workspace opened): show them.
    if (saved === undefined) return;
    setDraft(saved);
  }, [saved]);
  const type = (value: string) => {
    setDraft(value);
    setFieldDraft(key, value === text ? null : value);
  };
  const reset = () => {
    setDraft(text);
    setMessage(null);
    setFieldDraft(key, null);
  };
  const commit = () => {
    if (draft === text) {
      setMessage(null);
      setFieldDraft(key, null);
      return;
    }
    const r = parse(draft);
    if (r.ok) {
      setMessage(null);
      setFieldDraft(key, null);
      onCommit(r.value);
    } else setMessage(r.message);
  };
  const pending = saved !== undefined && saved === draft && message === null && !error;
  const shown = message ?? error ?? null;
  return (
    <label className={`roll-field${shown ? ' invalid' : ''}`} htmlFor={id}>
      <span className="roll-label">
        {label}
        {unit ? <span className="roll-unit"> ({unit})</span> : null}
      </span>
      <input
        id={id}
        type="text"
        value={draft}
        spellCheck={false}
        autoComplete="off"
        style={width ? { width } : undefined}
        aria-invalid={shown ? true : undefined}
        aria-describedby={shown ? `${id}-msg` : undefined}
        onChange={(e) => type(e.target.value)}
        onBlur={commit}
        onKeyDown={(e) => {
          if (e.key === 'Enter') commit();
          if (e.key === 'Escape') reset();
        }}
      />
      {pending && !shown ? <span className="roll-field-pending">typed, not applied yet: press Enter to apply, Escape to drop</span> : null}
      {shown ? (
        <span id={`${id}-msg`} className="roll-field-error" role="alert">
          {shown}
        </span>
      ) : null}
    </label>
  );
}

export interface RollSelectProps<T extends string | number> {
  readonly label: string;
  readonly unit?: string;
  readonly value: T;
  readonly options: readonly { readonly value: T; readonly label: string }[];
  readonly onChange: (value: T) => void;
}

/** A labelled select over fixed options. */
export function RollSelect<T extends string | number>({ label, unit, value, options, onChange }: RollSelectProps<T>) {
  const id = useId();
  return (
    <label className="roll-field" htmlFor={id}>
      <span className="roll-label">
        {label}
        {unit ? <span className="roll-unit"> ({unit})</span> : null}
      </span>
      <select
        id={id}
        value={String(value)}
        onChange={(e) => {
          const hit = options.find((o) => String(o.value) === e.target.value);
          if (hit) onChange(hit.value);
        }}
      >
        {options.map((o) => (
          <option key={String(o.value)} value={String(o.value)}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}
