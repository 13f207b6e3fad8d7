/**
 * What the sections that read a pasted list (Holidays, Fixings, Overnight curve) say about it: each
 * line not taken with its number and why, at most six named and the rest counted, and the status
 * line that carries the message.
 */

/** A line of a pasted list that was not taken (the core's readers report these). */
export interface ListProblem {
  readonly line: number;
  readonly text: string;
  readonly message: string;
}

/** `line 3 (text): why`. */
export const problemText = (p: ListProblem): string => `line ${p.line} (${p.text}): ${p.message}`;

/** "; not taken: a; b" (at most six named, the rest counted), or nothing when every line was taken. */
export const notTaken = (skipped: readonly string[]): string => (skipped.length === 0 ? '' : `; not taken: ${skipped.slice(0, 6).join('; ')}${skipped.length > 6 ? `; and ${skipped.length - 6} more` : ''}`);

/** The section's status line, announced to screen readers; nothing while there is no message. */
export function ListStatus({ message }: { readonly message: string | null }) {
  return message ? (
    <p role="status" className="small">
      {message}
    </p>
  ) : null;
}
