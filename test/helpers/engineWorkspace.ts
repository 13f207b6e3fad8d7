// An engine document (version 2) as the workbench's workspace, row ids r0, r1, ... in quote order,
// for component tests of turns, steps and the panels that read them.
import { readFileSync } from 'node:fs';
import { act } from '@testing-library/react';
import { workbenchFromEngine, type WorkbenchDocument } from '../../src/core/index.ts';
import { workbenchFromEngine as readWorkspaceFile } from '../../src/share/documentReader.ts';
import { useAppStore } from '../../src/state/store.ts';

/** The engine document read as the workbench reads a file; the test fails with the reader's first message. */
export function workbenchOf(engine: unknown): WorkbenchDocument {
  let n = 0;
  const doc = workbenchFromEngine(engine, () => `r${n++}`);
  if (!doc.ok) throw new Error(doc.errors[0]!.message);
  return doc.value;
}

/** Puts the engine document in the store as a replaced workspace (one undo step, labelled `label`). */
export function openEngineDocument(engine: unknown, label = 'test market'): void {
  const doc = workbenchOf(engine);
  act(() => useAppStore.getState().replaceWorkspace(doc, label));
}

/**
 * Registers the hooks of a whole-app component test on an engine document: the turns' code and the
 * feature panels loaded once, then before each test a fresh store and browser storage with the
 * document opened.
 */
export function withEngineWorkspace(engine: unknown, load: () => Promise<unknown>): void {
  beforeAll(load);
  beforeEach(() => {
    useAppStore.setState(useAppStore.getInitialState(), true);
    localStorage.clear();
    openEngineDocument(engine);
  });
}

/** The command line's invented two-curve document (test/fixtures/namedCurves/two-curves.json, see its SOURCE.md). */
export const TWO_CURVES = JSON.parse(readFileSync('test/fixtures/namedCurves/two-curves.json', 'utf8')) as Record<string, unknown> & { curve: Record<string, unknown>; curves: Record<string, unknown>[] };

let fileRow = 0;
/**
 * A workspace file opened as the workbench opens one (share/documentReader's reader, which reads
 * named curves), row ids t0, t1, ...; one undo step labelled 'open a file'. Returns the workspace.
 */
export function openWorkspaceFile(raw: unknown = TWO_CURVES): WorkbenchDocument {
  const wb = readWorkspaceFile(raw, () => `t${fileRow++}`);
  if (!wb.ok) throw new Error(wb.errors[0]!.message);
  act(() => useAppStore.getState().replaceWorkspace(wb.value, 'open a file'));
  return useAppStore.getState().workspace;
}
