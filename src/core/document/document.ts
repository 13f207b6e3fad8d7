import type { Scenario } from '../scenarios/scenarioShape.ts';
import type { Snapshot } from '../scenarios/scenarioSnapshots.ts';
import { coreError, type CoreError } from '../result.ts';
import type { Workspace } from './types.ts';
import { validateWorkspace, WORKSPACE_FORMAT, WORKSPACE_VERSION, type CurvesReader } from './validate.ts';
import { validateNote, validateScenarios, validateSnapshots, validateView, type ViewValue } from './documentKeys.ts';
import { depthProblem, LIMITS } from './limits.ts';
import { checkWorkbenchShape } from './workbenchShape.ts';
import { unknownSettings, WORKBENCH_FORMAT, type UnknownSetting } from './workbenchDocument.ts';
import { isPlainObject } from './plainObject.ts';

/** A workspace document after validation: the document itself (unchanged) and what was read from it. */
export interface CheckedDocument {
  /** The document exactly as given (after migration), to store, share or save. */
  readonly document: Record<string, unknown>;
  /** The engine's view of it; null when a workbench document's typed settlement or settings do not validate yet. */
  readonly workspace: Workspace | null;
  readonly scenarios: readonly Scenario[];
  readonly snapshots: readonly Snapshot[];
  readonly note: string;
  readonly view: Readonly<Record<string, ViewValue>>;
  /** Errors of single quotes: the document is kept (the quotes show their errors where they are typed). */
  readonly quoteErrors: readonly CoreError[];
  /**
   * Settings of a workbench document this build does not know (another build's interpolation,
   * day count...): the document is valid but must open read-only, never with defaults put in
   * their place. Empty for an engine document (the engine refuses unknown identifiers).
   */
  readonly unknowns: readonly UnknownSetting[];
}

export type DocumentOutcome = { readonly ok: true; readonly value: CheckedDocument } | { readonly ok: false; readonly errors: readonly CoreError[] };

/** A step that rewrites a document of `from` version into version `from + 1`. */
export interface DocumentMigration {
  readonly from: number;
  migrate(doc: Record<string, unknown>): Record<string, unknown>;
}

/**
 * Version 1 to 2: `settlement` becomes `valuationDate` (the same date, in the same place among the
 * keys); nothing else changes. A version 1 document has no calendar sections and its quotes no
 * calendar fields beyond those it already had, so it builds exactly as before (bit for bit).
 */
export const MIGRATE_1_TO_2: DocumentMigration = {
  from: 1,
  migrate(doc) {
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(doc)) {
      if (k === 'version') out.version = 2;
      else if (k === 'settlement') out.valuationDate = v;
      else out[k] = v;
    }
    return out;
  },
};

/** Migrations of older document versions, oldest first. */
export const DOCUMENT_MIGRATIONS: readonly DocumentMigration[] = [MIGRATE_1_TO_2];


/** Applies migrations from the document's version up to the current one; leaves other documents alone. */
export function migrateDocument(doc: Record<string, unknown>, migrations: readonly DocumentMigration[] = DOCUMENT_MIGRATIONS): Record<string, unknown> {
  let out = doc;
  for (let guard = 0; guard < 100 && typeof out.version === 'number' && out.version < WORKSPACE_VERSION; guard++) {
    const step = migrations.find((m) => m.from === out.version);
    if (!step) break;
    out = step.migrate(out);
  }
  return out;
}

/**
 * Validates a workspace document read from untrusted input (a link or a file): caps first (nesting
 * depth, quotes, scenarios, note, snapshots: LIMITS), then the engine's schema (validateWorkspace), then each
 * reserved key this module owns. Document-level errors refuse the document; errors of single
 * quotes are returned beside it. `strategy` is checked for size only; its owner validates it.
 * `readCurves` reads named curves (`readNamedCurves`, which the link and file readers pass, so the
 * first load does not carry it); without it a document with `curves` is refused, naming them.
 */
export function validateDocument(raw: unknown, migrations: readonly DocumentMigration[] = DOCUMENT_MIGRATIONS, readCurves?: CurvesReader): DocumentOutcome {
  if (!isPlainObject(raw)) return { ok: false, errors: [coreError('schema', '', 'a workspace document must be a JSON object')] };
  const deep = depthProblem(raw);
  if (deep) return { ok: false, errors: [coreError('range', '', deep)] };
  if (raw.format !== WORKSPACE_FORMAT && raw.format !== WORKBENCH_FORMAT) {
    return { ok: false, errors: [coreError('schema', 'format', `this is not a workspace document: format must be "${WORKBENCH_FORMAT}" or "${WORKSPACE_FORMAT}"`)] };
  }
  const doc = raw.format === WORKSPACE_FORMAT ? migrateDocument(raw, migrations) : raw;
  if (Array.isArray(doc.quotes) && doc.quotes.length > LIMITS.quotes) {
    return { ok: false, errors: [coreError('range', 'quotes', `${doc.quotes.length} quotes is more than the ${LIMITS.quotes} a workspace may hold`)] };
  }
  const errors: CoreError[] = [];
  let core: { workspace: Workspace | null; errors: readonly CoreError[] };
  if (doc.format === WORKBENCH_FORMAT) {
    if (doc.version !== 1) return { ok: false, errors: [coreError('unsupported-version', 'version', `workbench document version ${typeof doc.version === 'number' || typeof doc.version === 'string' ? String(doc.version).slice(0, 10) : doc.version === null ? 'null' : Array.isArray(doc.version) ? '(a list)' : `(${typeof doc.version})`} is not one this build reads (1)`)] };
    const shape = checkWorkbenchShape(doc);
    if (!shape.engineDoc) return { ok: false, errors: shape.errors };
    core = validateWorkspace(shape.engineDoc, readCurves);
  } else {
    core = validateWorkspace(doc, readCurves);
    if (!core.workspace) return { ok: false, errors: core.errors };
  }
  const s = validateScenarios(doc.scenarios);
  const n = validateNote(doc.note);
  const v = validateView(doc.view);
  const snaps = validateSnapshots(doc.snapshots);
  errors.push(...s.errors, ...n.errors, ...v.errors, ...snaps.errors);
  if (doc.strategy !== undefined) {
    const size = isPlainObject(doc.strategy) ? JSON.stringify(doc.strategy).length : -1;
    if (size < 0 || size > LIMITS.strategyJson) errors.push(coreError('range', 'strategy', `strategy must be an object of at most ${LIMITS.strategyJson} characters of JSON`));
  }
  if (errors.length > 0) return { ok: false, errors };
  return {
    ok: true,
    value: {
      document: doc,
      workspace: core.workspace,
      scenarios: s.scenarios,
      snapshots: snaps.snapshots,
      note: n.note,
      view: v.view,
      quoteErrors: core.errors,
      unknowns: doc.format === WORKBENCH_FORMAT ? unknownSettings(doc) : [],
    },
  };
}

/**
 * The caps every way in shares, for a parsed document from the command line (which validates
 * the rest itself): nesting depth and quote count (LIMITS). Empty when the document is within them.
 */
export function documentCapErrors(raw: unknown): CoreError[] {
  const deep = depthProblem(raw);
  if (deep) return [coreError('range', '', deep)];
  if (isPlainObject(raw) && Array.isArray(raw.quotes) && raw.quotes.length > LIMITS.quotes) {
    return [coreError('range', 'quotes', `${raw.quotes.length} quotes is more than the ${LIMITS.quotes} a workspace may hold`)];
  }
  return [];
}

/** Longest file read as a workspace (characters). */
export const MAX_FILE_CHARS = 4_000_000;

/** Parses and validates the text of a workspace file (named curves read by `readCurves`, as validateDocument). Never throws. */
export function parseDocumentText(text: string, readCurves?: CurvesReader): DocumentOutcome {
  if (text.length > MAX_FILE_CHARS) return { ok: false, errors: [coreError('range', '', `the file has ${text.length} characters; a workspace file is at most ${MAX_FILE_CHARS}`)] };
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch (e) {
    return { ok: false, errors: [coreError('invalid-json', '', `the file is not valid JSON (${e instanceof Error ? e.message.slice(0, 120) : 'parse error'}); choose a workspace file saved by this app`)] };
  }
  return validateDocument(parsed, DOCUMENT_MIGRATIONS, readCurves);
}

/** The document as a file: pretty JSON with a final newline. */
export const serialiseDocument = (doc: Record<string, unknown>): string => JSON.stringify(doc, null, 2) + '\n';

/** What a link carries: the whole document except snapshots. */
export function linkDocument(doc: Record<string, unknown>): Record<string, unknown> {
  const { snapshots: _snapshots, ...rest } = doc;
  return rest;
}
