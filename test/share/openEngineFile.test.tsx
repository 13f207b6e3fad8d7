// @vitest-environment jsdom
// The workbench opens the curve command's engine document (format "tenorscope-workspace"): its
// quotes become sheet rows that build the same curve, or the file is refused with the reason and
// the workspace is untouched. The README's engine example is the file opened.
import { README_DOCUMENT } from '../helpers/readmeDocument.ts';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { buildCurve, toEngineDocument } from '../../src/core/index.ts';
import { useAppStore } from '../../src/state/store.ts';

const README_DOC = README_DOCUMENT;
const file = (doc: unknown, name = 'engine.json') => new File([JSON.stringify(doc)], name, { type: 'application/json' });
const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

describe('opening an engine document in the workbench', { timeout: 30_000 }, () => {
  it('puts its quotes in the sheet (decimal unit) and builds the curve the command builds', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.upload(screen.getByLabelText('Workspace file to open'), file(README_DOC));
    // The file reader loads on the first open: wait until the file is opened, then read the store.
    expect(await screen.findByText(/Opened an engine workspace file/)).toBeInTheDocument();
    await waitFor(() => expect(useAppStore.getState().workspace.settlement).toBe('2027-03-10'));
    const ws = useAppStore.getState().workspace;
    expect(ws.settlement).toBe('2027-03-10');
    expect(ws.quoteUnit).toBe('decimal');
    expect(ws.quotes.map((q) => [q.kind, q.maturity, q.rate, q.price])).toEqual([
      ['deposit', '3M', '0.031', ''],
      ['bill', '2027-09-09', '0.03', ''],
      ['zero', '6M', '', '98.4'],
      ['bond', '2031-06-15', '', '101.25'],
      ['swap', '5Y', '0.0375', ''],
    ]);
    const a = buildCurve(README_DOC).curve!;
    const b = buildCurve(toEngineDocument(ws).doc).curve!;
    for (const p of a.pillars) expect(b.lnDiscountAt(p.t)).toBe(a.lnDiscountAt(p.t));
  });

  it('refuses a document whose zero carries a compounding the sheet cannot hold, and changes nothing', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    const before = useAppStore.getState().workspace;
    await user.upload(screen.getByLabelText('Workspace file to open'), file({ ...README_DOC, quotes: [...README_DOC.quotes, { kind: 'zero', tenor: '2Y', rate: 0.03, compounding: 'continuous' }] }));
    expect(await screen.findByText(/The file was not opened: quotes\[5\] \(a zero maturing 2029-03-10\): its compounding/)).toBeInTheDocument();
    expect(useAppStore.getState().workspace).toBe(before);
  });
});
