import { useEffect, useState } from 'react';
import { encodeWorkspaceLink } from './linkCodec.ts';
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

/** How long "Link copied" stays beside the button (ms). */
export const COPIED_STATUS_MS = 6000;

const pageAddress = (): string => window.location.href.split('#')[0]!;

/** Puts a link holding the whole workspace on the clipboard. Its accessible name is "Copy link". */
export function CopyLinkButton({ document: doc, baseUrl, writeText, onCopied }: CopyLinkButtonProps) {
  const [status, setStatus] = useState<{ text: string; error: boolean } | null>(null);
  // "Link copied" is news for a moment, then goes; a problem stays until the next try.
  useEffect(() => {
    if (!status || status.error) return;
    const timer = setTimeout(() => setStatus(null), COPIED_STATUS_MS);
    return () => clearTimeout(timer);
  }, [status]);
  const copy = async (): Promise<void> => {
    try {
      const url = `${baseUrl ?? pageAddress()}#${await encodeWorkspaceLink(doc)}`;
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
