import { useEffect, useState } from 'react';
import { formatCount } from '../core/index.ts';
import { MAX_FRAGMENT_CHARS } from './linkLimits.ts';

/** The link codec (compression, envelope, checks) is fetched when a link is first made or checked. */
const encodeWorkspaceLinkChecked = (doc: Record<string, unknown>) => import('./linkCodec.ts').then((m) => m.encodeWorkspaceLinkChecked(doc));
import './share.css';

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

/**
 * JSON at most this long always makes a link within MAX_FRAGMENT_CHARS (raw DEFLATE adds at most
 * 5 bytes per 65,535-byte stored block, base64 makes 4 characters of 3 bytes), so it needs no trial.
 */
const SURELY_FITS_CHARS = Math.floor((MAX_FRAGMENT_CHARS - 16) * 0.74);
/** A larger workspace is tried this long after its last change (encoding costs milliseconds). */
const CHECK_DELAY_MS = 400;

/**
 * Puts a link holding the whole workspace on the clipboard. Its accessible name is "Copy link".
 * A workspace too large for a link the app would open again is found before the user asks (tried
 * shortly after each change) and said next to the button; the button then makes no link.
 */
export function CopyLinkButton({ document: doc, baseUrl, writeText, onCopied }: CopyLinkButtonProps) {
  const [status, setStatus] = useState<{ text: string; error: boolean } | null>(null);
  const [tooLarge, setTooLarge] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    // The document's UTF-8 size bounds the link's envelope from above (snapshots are left out of a link).
    if (new TextEncoder().encode(JSON.stringify(doc)).length <= SURELY_FITS_CHARS) {
      setTooLarge(null);
      return;
    }
    const timer = setTimeout(() => {
      void encodeWorkspaceLinkChecked(doc).then(
        (r) => live && setTooLarge(r.ok ? null : r.message),
        () => undefined,
      );
    }, CHECK_DELAY_MS);
    return () => {
      live = false;
      clearTimeout(timer);
    };
  }, [doc]);
  // "Link copied" is news for a moment, then goes; a problem stays until the next try.
  useEffect(() => {
    if (!status || status.error) return;
    const timer = setTimeout(() => setStatus(null), COPIED_STATUS_MS);
    return () => clearTimeout(timer);
  }, [status]);
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
        setStatus({ text: `Link copied (${formatCount(url.length)} characters).`, error: false });
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
      <span role="status" aria-live="polite" className={status?.error || (tooLarge && !status) ? 'copy-link-status error' : 'copy-link-status'}>
        {status?.text ?? (tooLarge ? `Too large for a link: ${tooLarge}.` : '')}
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
