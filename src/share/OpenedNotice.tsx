import { create } from 'zustand';
import { useAppStore } from '../state/store.ts';

/** What replaced the open workspace (a link, the demo) and the one step that brings the user's own back. */
export interface OpenedNoticeState {
  readonly text: string;
  readonly action: { readonly label: string; readonly run: () => void; /** A fuller accessible name (containing the label), when the label alone would be ambiguous. */ readonly ariaLabel?: string } | null;
}

export const useOpenedNotice = create<{ notice: OpenedNoticeState | null }>(() => ({ notice: null }));

export const showOpenedNotice = (notice: OpenedNoticeState | null): void => useOpenedNotice.setState({ notice });

/** The notice after a link or "Reset to demo" replaced what was on screen. Plain text only. */
export function OpenedNotice() {
  const notice = useOpenedNotice((s) => s.notice);
  if (!notice) return null;
  return (
    <div className="banner link-notice" role="alert">
      <span>{notice.text}</span>
      {notice.action && (
        <button
          type="button"
          aria-label={notice.action.ariaLabel}
          onClick={() => {
            notice.action!.run();
            showOpenedNotice(null);
          }}
        >
          {notice.action.label}
        </button>
      )}
      <button type="button" onClick={() => showOpenedNotice(null)}>
        Dismiss
      </button>
    </div>
  );
}

/** "Reset to demo": replaces the workspace with the demo (undoable) and says how to get it back. */
export function resetToDemoWithNotice(): void {
  useAppStore.getState().resetToDemo();
  showOpenedNotice({ text: 'Replaced the workspace with the demo; your own is one Undo away.', action: { label: 'Undo', ariaLabel: 'Undo the reset', run: () => useAppStore.getState().undo() } });
}
