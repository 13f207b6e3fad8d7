import { useSyncExternalStore } from 'react';

/**
 * The pointer's maturity (years on the curve axis) shared by both charts. Kept outside the app
 * store on purpose: it changes at pointer rate and is never saved or undone.
 */
let hoverX: number | null = null;
const listeners = new Set<() => void>();

export const hoverStore = {
  get: (): number | null => hoverX,
  set(x: number | null): void {
    if (x === hoverX) return;
    hoverX = x;
    for (const l of listeners) l();
  },
  subscribe(l: () => void): () => void {
    listeners.add(l);
    return () => listeners.delete(l);
  },
};

export const useHoverX = (): number | null => useSyncExternalStore(hoverStore.subscribe, hoverStore.get, hoverStore.get);
