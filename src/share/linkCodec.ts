import { formatCount, formatNumber, linkDocument, readNamedCurves, validateDocument, type CheckedDocument, type DocumentMigration, DOCUMENT_MIGRATIONS } from '../core/index.ts';
import { decodeBase64Url, encodeBase64Url } from './base64url.ts';
import { BUILD_ID } from './buildId.ts';
import { deflateRaw, inflateRawCapped, type InflateOutcome } from './compression.ts';

/**
 * A shareable link carries the workspace document (without snapshots) in the URL fragment:
 *   #ws<version>.<payload>
 * where payload = URL-safe base64 (no padding) of raw DEFLATE of the UTF-8 JSON envelope
 * {"b": buildId, "d": document}. Version 1 is the current link format.
 */
export const LINK_VERSION = 1;
export const LINK_PREFIX = 'ws';
/** Largest fragment read, characters. */
import { MAX_FRAGMENT_CHARS } from './linkLimits.ts';
export { MAX_FRAGMENT_CHARS };
/** Largest decompressed envelope, bytes; decompression stops as soon as it is passed. */
export const MAX_INFLATED_BYTES = 1024 * 1024;

export type LinkFailure = 'none' | 'too-long' | 'not-a-link' | 'newer-version' | 'damaged' | 'too-large' | 'not-json' | 'invalid';

export type LinkOutcome =
  | {
      readonly ok: true;
      readonly checked: CheckedDocument;
      readonly buildId: string;
      readonly sameBuild: boolean;
      /** Shown beside the opened workspace, for example when the link comes from another build. */
      readonly notice: string | null;
    }
  | { readonly ok: false; readonly failure: LinkFailure; readonly message: string };

const KEEP = ' Your saved workspace has not been changed.';
const failure = (f: LinkFailure, message: string): LinkOutcome => ({ ok: false, failure: f, message: f === 'none' ? message : message + KEEP });

/** Encodes a workspace document as a link fragment (without the leading #). Snapshots are left out. */
export async function encodeWorkspaceLink(doc: Record<string, unknown>, buildId: string = BUILD_ID): Promise<string> {
  const json = JSON.stringify({ b: buildId, d: linkDocument(doc) });
  const packed = await deflateRaw(new TextEncoder().encode(json));
  return `${LINK_PREFIX}${LINK_VERSION}.${encodeBase64Url(packed)}`;
}

/** A link for a document, or why the document does not fit one (said before any link is made). */
export type LinkEncoding = { readonly ok: true; readonly fragment: string } | { readonly ok: false; readonly message: string };

/**
 * Encodes a document as a link fragment only when the app will open it again: within the fragment
 * cap (MAX_FRAGMENT_CHARS) and the inflated cap (MAX_INFLATED_BYTES). A workspace within the
 * document caps (LIMITS) always inflates to less than the inflated cap; whether it fits the fragment
 * depends on how well its text compresses, so a workspace that does not fit is told to use a file.
 */
export async function encodeWorkspaceLinkChecked(doc: Record<string, unknown>, buildId: string = BUILD_ID): Promise<LinkEncoding> {
  const json = JSON.stringify({ b: buildId, d: linkDocument(doc) });
  const bytes = new TextEncoder().encode(json).length;
  if (bytes > MAX_INFLATED_BYTES) {
    return { ok: false, message: `this workspace is ${formatNumber(bytes / 1024, 0)} KB of text, more than the ${MAX_INFLATED_BYTES / 1024} KB a link may hold; save a workspace file instead` };
  }
  const fragment = await encodeWorkspaceLink(doc, buildId);
  if (fragment.length > MAX_FRAGMENT_CHARS) {
    return {
      ok: false,
      message: `this workspace needs a link of ${formatCount(fragment.length)} characters, more than the ${formatCount(MAX_FRAGMENT_CHARS)} a link may have; save a workspace file instead`,
    };
  }
  return { ok: true, fragment };
}

/** Older link formats and how to read them; none has been published before version 1. */
const LINK_MIGRATIONS: Readonly<Record<number, (envelope: unknown) => unknown>> = {};

/**
 * Decodes a link fragment (with or without the leading #) into a validated document. Untrusted
 * input: the fragment length, the decompressed size, every collection and string are capped, the
 * document is validated like a file and migrated from older versions. Never throws; a failure
 * is a message for the user. Nothing here renders or runs what the link holds. `inflate` is the
 * platform's streaming inflater; a test may pass an equivalent (the link fuzzer uses Node's zlib,
 * which runs its thousands of cases in seconds).
 */
export async function decodeWorkspaceLink(
  fragment: string,
  currentBuild: string = BUILD_ID,
  migrations: readonly DocumentMigration[] = DOCUMENT_MIGRATIONS,
  inflate: (bytes: Uint8Array, cap: number) => Promise<InflateOutcome> = inflateRawCapped,
): Promise<LinkOutcome> {
  try {
    return await decode(fragment, currentBuild, migrations, inflate);
  } catch {
    return failure('damaged', 'This link could not be read: it is damaged or incomplete. Ask for the link again.');
  }
}

async function decode(fragment: string, currentBuild: string, migrations: readonly DocumentMigration[], inflate: (bytes: Uint8Array, cap: number) => Promise<InflateOutcome>): Promise<LinkOutcome> {
  if (typeof fragment !== 'string') return failure('not-a-link', 'This is not a workspace link.');
  const text = fragment.startsWith('#') ? fragment.slice(1) : fragment;
  if (text === '') return failure('none', 'There is no workspace in this address.');
  if (text.length > MAX_FRAGMENT_CHARS) {
    return failure('too-long', `This link is ${text.length} characters long; a workspace link is at most ${MAX_FRAGMENT_CHARS}. Share the workspace as a file instead.`);
  }
  const head = /^ws(\d{1,4})\.([A-Za-z0-9_-]*)$/.exec(text);
  if (!head) return failure('not-a-link', 'This address does not hold a workspace link (it should start with #ws1.). Check that the whole link was copied.');
  const version = Number(head[1]);
  if (version > LINK_VERSION) return failure('newer-version', `This link was made by a newer version of Tenorscope (link format ${version}; this one reads up to ${LINK_VERSION}). Open it with the newer version.`);
  if (version < 1) return failure('not-a-link', `Link format ${version} does not exist; check that the whole link was copied.`);
  const bytes = decodeBase64Url(head[2]!);
  if (!bytes || bytes.length === 0) return failure('damaged', 'This link is damaged: it holds characters a link cannot contain, or nothing. Check that the whole link was copied.');
  const inflated = await inflate(bytes, MAX_INFLATED_BYTES);
  if (!inflated.ok) {
    return inflated.reason === 'too-large'
      ? failure('too-large', `This link expands to more than ${MAX_INFLATED_BYTES / 1024 / 1024} MB, more than any workspace needs, so it was not opened.`)
      : failure('damaged', 'This link is damaged or incomplete: it could not be decompressed. Check that the whole link was copied.');
  }
  let envelope: unknown;
  try {
    envelope = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(inflated.bytes));
  } catch {
    return failure('not-json', 'This link is damaged: its content is not a workspace. Ask for the link again.');
  }
  const migrate = LINK_MIGRATIONS[version];
  if (migrate) envelope = migrate(envelope);
  if (typeof envelope !== 'object' || envelope === null || Array.isArray(envelope)) return failure('invalid', 'This link does not hold a workspace.');
  const env = envelope as Record<string, unknown>;
  const b = env.b;
  if (typeof b !== 'string' || b.length === 0 || b.length > 64 || Object.keys(env).some((k) => k !== 'b' && k !== 'd')) {
    return failure('invalid', 'This link does not hold a workspace in the expected form.');
  }
  // Named curves are read here (this module loads on first use, so the first load does not carry the reader).
  const checked = validateDocument(env.d, migrations, readNamedCurves);
  if (!checked.ok) {
    const first = checked.errors.slice(0, 3).map((e) => e.message).join('; ');
    const more = checked.errors.length > 3 ? ` (and ${checked.errors.length - 3} more)` : '';
    return failure('invalid', `This link's workspace is not valid: ${first}${more}.`);
  }
  const sameBuild = b === currentBuild;
  return {
    ok: true,
    checked: checked.value,
    buildId: b,
    sameBuild,
    notice: checked.value.unknowns.length > 0
      ? `This link${sameBuild ? '' : ` was made with build ${b} (this is build ${currentBuild}) and`} uses ${checked.value.unknowns.length === 1 ? 'a setting' : `${checked.value.unknowns.length} settings`} this build does not know, so it is open read-only; nothing was put in their place.`
      : sameBuild
        ? null
        : `This link was made with build ${b}; this is build ${currentBuild}. The inputs are the same, but the numbers may differ slightly if the methods changed.`,
  };
}

/** What opening a link does to the workbench: the workspace to show, the saved one untouched, and a message. */
export interface OpenedLink<T> {
  /** The workspace to show: the link's document, or the saved one when the link failed. */
  readonly current: Record<string, unknown> | T;
  /** The saved workspace, returned as it came in (the same value). */
  readonly saved: T;
  readonly fromLink: boolean;
  readonly message: string | null;
}

/**
 * Opens a link fragment against the user's saved workspace. The saved value is never changed and is
 * returned as it came; a bad link leaves `current` on it with a message saying what was wrong.
 */
export async function openLink<T>(fragment: string, saved: T, currentBuild: string = BUILD_ID): Promise<OpenedLink<T>> {
  const outcome = await decodeWorkspaceLink(fragment, currentBuild);
  if (!outcome.ok) return { current: saved, saved, fromLink: false, message: outcome.failure === 'none' ? null : outcome.message };
  return { current: outcome.checked.document, saved, fromLink: true, message: outcome.notice };
}
