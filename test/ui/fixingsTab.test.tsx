// @vitest-environment jsdom
// The Fixings section: a pasted list of overnight fixings becomes the workspace's `fixings` (one
// undo step), and a future whose reference period has begun reads its past days from it. Sources:
// the 1M contract's rule (CME One-Month SOFR futures: the average of every calendar day of the
// month, a non-business day carrying the preceding business day's rate; MARKET-CONVENTIONS.md
// section e); the US government securities calendar (SIFMA: no closing in 1-14 December 2026, from
// the calendar's rules, test/core/time/calendars.test.ts). The rates are invented (demo data).
import { act, fireEvent, render, screen } from '@testing-library/react';
import { FixingsTab } from '../../src/features/calendars/FixingsTab.tsx';
import { useAppStore } from '../../src/state/store.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { DEMO_SETTLEMENT } from '../../src/state/demoWorkspace.ts';
import { LIMITS } from '../../src/core/index.ts';

const s = () => useAppStore.getState();

beforeEach(() => {
  useAppStore.setState(useAppStore.getInitialState(), true);
});

/** The business days of 1-14 December 2026 (Monday to Friday; no holiday), with invented rates in %. */
const DECEMBER = ['01', '02', '03', '04', '07', '08', '09', '10', '11', '14'].map((d, i) => `2026-12-${d}\t${(4.3 + i / 100).toFixed(2)}`).join('\n');

describe('FixingsTab', () => {
  it('a December 2026 1M future in its period builds once its past days are pasted; Undo takes the list back', () => {
    expect(DEMO_SETTLEMENT).toBe('2026-12-15');
    const row = s().workspace.quotes[11]!;
    act(() => {
      for (const [column, text] of [['kind', 'future'], ['maturity', '2026-12 1M'], ['rate', ''], ['price', '95.65'], ['coupon', ''], ['frequency', ''], ['dayCount', '']] as const) s().setCell(row.id, column, text);
    });
    const issue = () => JSON.stringify(deriveBuild(s().workspace).rowIssues[11]);
    expect(issue()).toMatch(/needs the overnight fixings so far; give them as fixings, in the workspace's list or on the quote: 2026-12-01/);
    render(<FixingsTab />);
    expect(screen.getByText('No fixings in this workspace.')).toBeInTheDocument();
    fireEvent.change(screen.getByRole('textbox', { name: /Paste fixings/ }), { target: { value: `Date\tSOFR\n${DECEMBER}\n2026-12-15 4.40` } });
    fireEvent.click(screen.getByRole('button', { name: 'Add to the list' }));
    // The valuation date's own rate is not known yet: that line is not taken, and says why; the rest build the row.
    expect(screen.getByRole('status').textContent).toBe('10 fixings added or replaced; not taken: line 12 (2026-12-15 4.40): 2026-12-15 is on or after the valuation date 2026-12-15: its rate is not known yet.');
    expect(screen.getByText('10 fixings, 2026-12-01 to 2026-12-14.')).toBeInTheDocument();
    expect(s().workspace.fixings!['2026-12-14']).toBe(0.0439);
    expect(deriveBuild(s().workspace).rowIssues[11]).toEqual({});
    expect(deriveBuild(s().workspace).build.errors).toEqual([]);
    fireEvent.change(screen.getByRole('textbox', { name: /Paste fixings/ }), { target: { value: '2026-12-01 4.5' } });
    fireEvent.click(screen.getByRole('button', { name: 'Replace the list' }));
    expect(s().workspace.fixings).toEqual({ '2026-12-01': 0.045 });
    expect(JSON.stringify(deriveBuild(s().workspace).rowIssues[11])).toMatch(/the workspace's fixings lack 2026-12-02/);
    act(() => s().undo());
    expect(Object.keys(s().workspace.fixings!)).toHaveLength(10);
    act(() => s().undo());
    expect(s().workspace.fixings).toBeUndefined();
  });

  it('names the lines it did not take', () => {
    render(<FixingsTab />);
    fireEvent.change(screen.getByRole('textbox', { name: /Paste fixings/ }), { target: { value: '2026-12-01 4.30\nDecember 2 4.31' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add to the list' }));
    expect(screen.getByRole('status').textContent).toMatch(/^1 fixing added or replaced; not taken: line 2 \(December 2 4\.31\): does not start with a date/);
  });
});

describe('FixingsTab and the workspace cap', () => {
  it('refuses a paste that would make the list longer than a file or a link may hold (LIMITS.fixings), keeping the list', () => {
    // The same cap as the engine's check of a file and the shape check of a link (src/core/document/limits.ts).
    act(() => s().setSettlement('2050-01-03'));
    render(<FixingsTab />);
    const lines: string[] = [];
    for (let d = Date.UTC(2025, 0, 1), n = 0; n <= LIMITS.fixings; d += 86_400_000, n++) lines.push(`${new Date(d).toISOString().slice(0, 10)}\t4.30`);
    fireEvent.change(screen.getByRole('textbox', { name: /Paste fixings/ }), { target: { value: lines.join('\n') } });
    fireEvent.click(screen.getByRole('button', { name: 'Replace the list' }));
    expect(screen.getByRole('status').textContent).toMatch(/^Not taken: the list would hold 5,001 fixings, more than the 5,000 a workspace keeps/);
    expect(s().workspace.fixings).toBeUndefined();
  });
});
