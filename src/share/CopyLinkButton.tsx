import { useState } from 'react';
import { encodeWorkspaceLinkChecked } from './linkCodec.ts';
import '../features/scenarios/scenarios.css';

export interface CopyLinkButtonProps {
  /** The workspace document to share (snapshots are left out of the link). */
  readonly document: Record<string, unknown>;
  /** Address the fragment is appended to; defaults to this page without its fragment. */
  readonly baseUrl?: string;
  /** Writes to the clipboard; defaults to navigator.clipboard.writeText. */
  readonly writeText?: (text: string) => Promise<void>;
  /** Called with the full link after it is copied (for example to show it in a text box). */
  readonly onCopied?: (url: string) => void;
}

const pageAddress = (): string => window.location.href.split('#')[0]!;

/** Puts a link holding the whole workspace on the clipboard. Its accessible name is "Copy link". */
export function CopyLinkButton({ document: doc, baseUrl, writeText, onCopied }: CopyLinkButtonProps) {
  const [status, setStatus] = useState<{ text: string; error: boolean } | null>(null);
  const copy = async (): Promise<void> => {
    try {
      // A workspace too large for a link the app would open again gets no link, and is told why.
      const encoded = await encodeWorkspaceLinkChecked(doc);
      if (!encoded.ok) {
        setStatus({ text: `No link: ${encoded.message}.`, error: true });
        return;
      }
      const url = `${baseUrl ?? pageAddress()}#${encoded.fragment}`;
      const write = writeText ?? ((t: string) => navigator.clipboard.writeText(t));
      try {
        await write(url);
        setStatus({ text: `Link copied (${url.length.toLocaleString('en-US')} characters).`, error: false });
      } catch {
        setStatus({ text: 'The browser refused the clipboard; select the link below and copy it.', error: true });
      }
      onCopied?.(url);
    } catch (e) {
      setStatus({ text: `No link: ${e instanceof Error ? e.message : 'the workspace could not be encoded'}.`, error: true });
    }
  };
  return (
    <span className="copy-link">
      <button type="button" onClick={() => void copy()} title="Copy a link that opens this workspace (quotes, settings, scenarios, note; not snapshots)">
        Copy link
      </button>
      <span role="status" aria-live="polite" className={status?.error ? 'copy-link-status error' : 'copy-link-status'}>
        {status?.text ?? ''}
      </span>
    </span>
  );
}

/** The message after opening a link: a notice (another build) or why the link was not opened. Plain text only. */
export function LinkNotice({ message, onDismiss }: { message: string | null; onDismiss?: () => void }) {
  if (!message) return null;
  return (
    <div className="banner link-notice" role="alert">
      <span>{message}</span>
      {onDismiss && (
        <button type="button" onClick={onDismiss}>
          Dismiss
        </button>
      )}
    </div>
  );
}
