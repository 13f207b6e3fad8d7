import { useId } from 'react';
import { formatCount, LIMITS } from '../../core/index.ts';
import { PRINT_NOTE_CHARS } from './PrintSummary.tsx';

export interface NoteEditorProps {
  readonly value: string;
  readonly onChange: (text: string) => void;
  /** Called when the field loses focus (ends one undo step of typing). */
  readonly onDone?: () => void;
}

/** The workspace note: saved, undone and shared with the workspace; the first 600 characters are printed. */
export function NoteEditor({ value, onChange, onDone }: NoteEditorProps) {
  const id = useId();
  const length = value.length;
  return (
    <div className="note-editor">
      <label htmlFor={id}>Note</label>
      <textarea id={id} value={value} maxLength={LIMITS.note} rows={4} onChange={(e) => onChange(e.target.value.slice(0, LIMITS.note))} onBlur={onDone} aria-describedby={`${id}-count`} />
      <span id={`${id}-count`} className={length > PRINT_NOTE_CHARS ? 'small warn' : 'small muted'}>
        {formatCount(length)} / {formatCount(LIMITS.note)} characters
        {length > PRINT_NOTE_CHARS ? `; the printed page shows the first ${PRINT_NOTE_CHARS}` : ''}
      </span>
    </div>
  );
}
