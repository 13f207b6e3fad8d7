import { useEffect, useReducer } from 'react';
import type { OvernightKit, WorkbenchDocument } from '../core/index.ts';

/**
 * The engine's code of turns and meeting steps (OVERNIGHT_KIT), fetched on first use: a workspace
 * without turns or steps never loads it, so the first screen does not carry it. Until it is here,
 * a workspace that needs it builds no curve and says the turns and steps are loading; the base
 * build is derived again once it arrives (it is among the build's inputs).
 */
let kit: OvernightKit | null = null;
let pending: Promise<OvernightKit> | null = null;

/** The kit when loaded, else null. */
export const loadedOvernightKit = (): OvernightKit | null => kit;

/** Fetches the kit (once); resolves with it. */
export function loadOvernightKit(): Promise<OvernightKit> {
  pending ??= import('./overnightKitModule.ts').then(
    (m) => (kit = m.OVERNIGHT_KIT),
    (error: unknown) => {
      pending = null; // a later call tries again
      throw error;
    },
  );
  return pending;
}

/** Whether a document's build needs the kit: turns, or meeting steps switched on. */
export const needsOvernightKit = (ws: { readonly turns?: WorkbenchDocument['turns'] | undefined; readonly meetingSteps?: WorkbenchDocument['meetingSteps'] | undefined }): boolean => (ws.turns?.length ?? 0) > 0 || ws.meetingSteps?.on === true;

/** The kit, fetched when `needed`; re-renders the caller once it arrives. */
export function useOvernightKit(needed: boolean): OvernightKit | null {
  const [, arrived] = useReducer((n: number) => n + 1, 0);
  useEffect(() => {
    if (!needed || kit !== null) return;
    let live = true;
    loadOvernightKit().then(
      () => live && arrived(),
      () => undefined, // the build keeps saying it is loading; a later edit tries again
    );
    return () => {
      live = false;
    };
  }, [needed]);
  return kit;
}

type WorkbenchBuildOptions = { readonly skipInvalid: true; readonly overnight?: OvernightKit };
const WITHOUT_KIT: WorkbenchBuildOptions = { skipInvalid: true };
let withKit: WorkbenchBuildOptions | null = null;
/**
 * The workbench's build options (`skipInvalid`), with the kit once it is loaded: what every rebuild
 * of the workspace passes. One object each way, so a memo keyed on it holds.
 */
export const workbenchBuildOptions = (): WorkbenchBuildOptions => (kit ? (withKit ??= { skipInvalid: true, overnight: kit }) : WITHOUT_KIT);
