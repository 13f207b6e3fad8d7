import type { ReactNode } from 'react';
import { useAppStore } from '../state/store.ts';

/**
 * Controls that change the workspace, disabled while it is open read-only (settings this build
 * does not know; see ReadOnlyBanner): a fieldset with `display: contents`, so it changes no layout
 * and the browser greys out and skips every control inside. Controls that only export or read
 * (downloads, print) stay outside it.
 */
export function EditLock({ children }: { children: ReactNode }) {
  const locked = useAppStore((s) => s.readOnly !== null);
  return (
    <fieldset className="edit-lock" disabled={locked} {...(locked ? { 'data-locked': 'true' } : {})}>
      {children}
    </fieldset>
  );
}
