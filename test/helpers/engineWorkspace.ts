// An engine document (version 2) as the workbench's workspace, row ids r0, r1, ... in quote order,
// for component tests of turns, steps and the panels that read them.
import { act } from '@testing-library/react';
import { workbenchFromEngine, type WorkbenchDocument } from '../../src/core/index.ts';
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
