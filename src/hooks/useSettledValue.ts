import { useEffect, useState } from 'react';
import { whenIdle } from './useMethodOverlay.ts';

/** How long the inputs must stay unchanged before heavier panels follow them. */
export const SETTLE_MS = 120;

/**
 * The value as it was when it last stayed unchanged for `delayMs` and the browser was idle: heavier
 * panels (roll versus term, scenarios, the other sections) follow the base build once typing
 * pauses, so each keystroke repaints the sheet, charts and tables first.
 */
export function useSettledValue<T>(value: T, delayMs = SETTLE_MS): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    if (Object.is(value, settled)) return;
    let cancelIdle: (() => void) | null = null;
    const timer = setTimeout(() => {
      cancelIdle = whenIdle(() => setSettled(() => value));
    }, delayMs);
    return () => {
      clearTimeout(timer);
      cancelIdle?.();
    };
  }, [value, settled, delayMs]);
  return settled;
}
