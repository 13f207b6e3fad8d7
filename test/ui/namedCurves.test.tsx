// @vitest-environment jsdom
// Several curves in the workbench (issue 18 item 10): a workspace file with named curves opens and
// keeps them unchanged through the store, a saved file, a link, the browser's saved entry and the
// engine document (the command line prints the same curves from the saved file as from the
// original); the picker switches the curve the tables show (the key maturities' discount factors
// are the named curve's own, read by the core's discountOn); the spread table is the core's
// curveSpreadAt; the named curves' errors are named, the file kept. The fixture is the command
// line's invented test document (test/fixtures/namedCurves/SOURCE.md).
import { readFileSync } from 'node:fs';
import { act, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { runCurveCommand } from '../../src/cli/curveCommand.ts';
import {
  bpFigure,
  buildWorkbenchCurves,
  curveSpreadAt,
  discountOn,
  engineFromAnyDocument,
  formatNumber,
  marketDate,
  parseTenor,
  readWorkbenchDocument,
  serialiseDocument,
  type WorkbenchDocument,
} from '../../src/core/index.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { decodeWorkspaceLink, encodeWorkspaceLinkChecked } from '../../src/share/linkCodec.ts';
import { parseDocumentText, workbenchFromEngine } from '../../src/share/documentReader.ts';
import { checkRestoredWorkspace } from '../../src/state/restoreCheck.ts';
import { useAppStore } from '../../src/state/store.ts';
import { openWorkspaceFile, TWO_CURVES } from '../helpers/engineWorkspace.ts';

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const TEXT = readFileSync('test/fixtures/namedCurves/two-curves.json', 'utf8');
const FIXTURE = TWO_CURVES;
const initial = useAppStore.getInitialState();
const open = openWorkspaceFile;

beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

describe('a workspace with named curves, kept', () => {
  it('keeps a named curve whose future carries its own fixings through the saved file and the link (what the engine takes opens again)', async () => {
    // The fixture with an invented one-month future on the index curve, its first days fixed (engine form).
    const curves = FIXTURE.curves.map((c, i) => (i === 0 ? { ...c, quotes: [...(c.quotes as object[]), { kind: 'future', contract: '1M', month: '2027-03', price: 97.5, fixings: { '2027-03-01': 0.0241, '2027-03-02': 0.0242, '2027-03-03': 0.0241, '2027-03-04': 0.0241, '2027-03-05': 0.0242, '2027-03-08': 0.0242, '2027-03-09': 0.0241 } }] } : c));
    const ws = open({ ...FIXTURE, curves });
    expect(ws.curves).toEqual(curves);
    const file = parseDocumentText(serialiseDocument(ws as unknown as Record<string, unknown>));
    if (!file.ok) throw new Error(file.errors[0]!.message);
    expect(readWorkbenchDocument(file.value.document, () => 'x').doc!.curves).toEqual(curves);
    const link = await encodeWorkspaceLinkChecked(ws as unknown as Record<string, unknown>);
    if (!link.ok) throw new Error(link.message);
    const back = await decodeWorkspaceLink(link.fragment);
    if (!back.ok) throw new Error(back.message);
    expect(back.checked.document.curves).toEqual(curves);
  });

  it('opens from the engine file and keeps its curves unchanged through save, file, link, the saved entry and the engine document', async () => {
    const parsed = parseDocumentText(TEXT);
    expect(parsed.ok).toBe(true);
    const ws = open();
    expect(ws.curves).toEqual(FIXTURE.curves);
    // A cell edit and its undo leave them where they were.
    act(() => useAppStore.getState().setCell(ws.quotes[0]!.id, 'rate', '0.022'));
    expect(useAppStore.getState().workspace.curves).toBe(ws.curves);
    act(() => useAppStore.getState().undo());
    // The saved file, read back as a file.
    const file = parseDocumentText(serialiseDocument(useAppStore.getState().workspace as unknown as Record<string, unknown>));
    if (!file.ok) throw new Error(file.errors[0]!.message);
    expect(readWorkbenchDocument(file.value.document, () => 'x').doc!.curves).toEqual(FIXTURE.curves);
    // The link.
    const link = await encodeWorkspaceLinkChecked(useAppStore.getState().workspace as unknown as Record<string, unknown>);
    if (!link.ok) throw new Error(link.message);
    const back = await decodeWorkspaceLink(link.fragment);
    if (!back.ok) throw new Error(back.message);
    expect(back.checked.document.curves).toEqual(FIXTURE.curves);
    // The browser's saved entry; one whose curves are not a list says it left them out.
    expect(checkRestoredWorkspace(JSON.parse(JSON.stringify(useAppStore.getState().workspace))).doc!.curves).toEqual(FIXTURE.curves);
    const damaged = checkRestoredWorkspace({ ...JSON.parse(JSON.stringify(useAppStore.getState().workspace)), curves: { euribor6m: {} } });
    expect(damaged.doc!.curves).toBeUndefined();
    expect(damaged.notes).toContain('the saved named curves (curves) are an object, not a list of curves, and were left out');
    // The engine document, and the command line's output of the saved file equals that of the original.
    const engine = engineFromAnyDocument(JSON.parse(serialiseDocument(useAppStore.getState().workspace as unknown as Record<string, unknown>)));
    expect((engine.doc as Record<string, unknown>).curves).toEqual(FIXTURE.curves);
    const run = async (doc: unknown) => JSON.parse((await runCurveCommand(['-'], () => JSON.stringify(doc))).stdout.trim()) as { curves: unknown };
    expect((await run(engine.doc)).curves).toEqual((await run(FIXTURE)).curves);
  });

  it('the default curve is built alone, exactly as the same document without named curves', () => {
    const ws = open();
    const { curves: _c, ...single } = FIXTURE;
    let k = 0;
    const plain = workbenchFromEngine(single, () => `p${k++}`);
    if (!plain.ok) throw new Error('plain');
    const a = deriveBuild(ws).build.curve!;
    const b = deriveBuild(plain.value).build.curve!;
    expect(a.pillars.map((p) => p.discount)).toEqual(b.pillars.map((p) => p.discount));
  });
});

describe('the picker and the spread', () => {
  it('shows the named curve the picker chooses in the key maturities, and the spread the core computes', async () => {
    const user = userEvent.setup({ delay: null });
    const ws = open();
    render(<App />);
    const picker = await screen.findByRole('combobox', { name: 'Curve shown' }, { timeout: 20_000 });
    const table = () => screen.getByRole('table', { name: 'Key maturities' });
    const cellOf = (tenor: string) => {
      const row = within(table()).getByRole('rowheader', { name: tenor }).closest('tr')!;
      return { date: row.querySelectorAll('td')[0]!.textContent!, discount: row.querySelector('[data-field="discount"]')!.textContent! };
    };
    const defaultCurve = deriveBuild(ws).build.curve!;
    const named = buildWorkbenchCurves(ws, defaultCurve);
    const euribor = named.curves.find((c) => c.name === 'euribor6m')!.build.curve!;
    const df = (curve: typeof euribor, date: string) => {
      const r = discountOn(curve, date);
      if (!r.ok) throw new Error(r.errors[0]!.message);
      return formatNumber(r.value.discount, 8);
    };
    const before = cellOf('2Y');
    expect(before.discount).toBe(df(defaultCurve, before.date));
    await user.selectOptions(picker, 'euribor6m');
    expect(useAppStore.getState().workspace.view).toMatchObject({ shownCurve: 'euribor6m' });
    const after = cellOf('2Y');
    expect(after.discount).toBe(df(euribor, after.date));
    expect(after.discount).not.toBe(before.discount);
    expect(screen.getByText(/The charts and tables show the curve/).textContent).toContain('euribor6m');
    // Its quotes, read-only, with the curve each builds and the curve that discounted it.
    const quotes = screen.getByRole('table', { name: 'Quotes of the curve euribor6m' });
    const rows = within(quotes).getAllByRole('row').slice(1).map((r) => [...r.querySelectorAll('td')].map((c) => c.textContent));
    expect(rows.map((r) => [r[1], r[4], r[5]])).toEqual([
      ['deposit', 'euribor6m', 'none (own DF ratio)'],
      ['swap', 'euribor6m', 'default'],
      ['swap', 'euribor6m', 'default'],
    ]);
    // A named curve's quote value typed in its row: one undo step, the curve rebuilt from it.
    const ten = screen.getByRole('textbox', { name: 'euribor6m quote 3 rate' });
    await user.clear(ten);
    await user.type(ten, '0.0321');
    await user.tab();
    const edited = useAppStore.getState().workspace.curves as { quotes: Record<string, unknown>[] }[];
    expect(edited[0]!.quotes[2]).toEqual({ kind: 'swap', tenor: '10Y', rate: 0.0321 });
    expect(edited[1]).toBe(ws.curves![1]); // the other curve is the very same object
    const rebuilt = buildWorkbenchCurves(useAppStore.getState().workspace, defaultCurve).curves.find((c) => c.name === 'euribor6m')!.build.curve!;
    expect(cellOf('2Y').discount).toBe(df(rebuilt, after.date));
    expect(cellOf('10Y').discount).toBe(df(rebuilt, cellOf('10Y').date));
    expect(cellOf('10Y').discount).not.toBe(df(euribor, cellOf('10Y').date));
    // Text that is no number is kept as typed and named as an error; the rest of the curve still builds.
    await user.clear(ten);
    await user.type(ten, '3.2x');
    await user.tab();
    expect((useAppStore.getState().workspace.curves as { quotes: Record<string, unknown>[] }[])[0]!.quotes[2]!.rate).toBe('3.2x');
    expect(screen.getAllByText(/curves\[0\] "euribor6m": quotes\[2\]\.rate: must be a number from -0\.1 to 1, not the text "3\.2x"/).length).toBeGreaterThan(0);
    act(() => useAppStore.getState().undo());
    act(() => useAppStore.getState().undo());
    expect(useAppStore.getState().workspace.curves).toEqual(FIXTURE.curves);
    expect(cellOf('2Y').discount).toBe(after.discount);
    // Undo brings the default curve back.
    act(() => useAppStore.getState().undo());
    expect(cellOf('2Y').discount).toBe(before.discount);
    // The spread of euribor6m over the default curve, zero rates in the display's convention.
    const spread = screen.getByRole('table', { name: /^Spread of euribor6m over default, zero rates/ });
    const row5 = within(spread).getByRole('rowheader', { name: '5Y' }).closest('tr')!;
    const date5 = marketDate('2027-03-10', parseTenor('5Y')!);
    const [p] = curveSpreadAt(euribor, defaultCurve, 'zero', [date5], ws.display.compounding, ws.display.dayCount, parseTenor(ws.display.forwardTenor)!);
    expect(row5.querySelectorAll('td')[3]!.textContent).toBe(bpFigure(p!.bp));
    expect(Math.abs(p!.bp)).toBeGreaterThan(1);
  });

  it("a workspace of one curve shows no picker and carries no named curves (that their code stays in the later chunk is the bundle test's)", () => {
    render(<App />);
    expect(screen.queryByRole('combobox', { name: 'Curve shown' })).toBeNull();
    expect(useAppStore.getState().workspace.curves).toBeUndefined();
  });

  it('names what to change when a curve name is used twice, and keeps the curves as they are', async () => {
    const ws = open();
    const twice = [ws.curves![0], { ...(ws.curves![1] as object), name: 'euribor6m' }];
    act(() => useAppStore.getState().replaceWorkspace({ ...ws, curves: twice }, 'a file with a name used twice'));
    render(<App />);
    const alert = await screen.findByText(/the curve name "euribor6m" is used twice \(curves\[0\] and curves\[1\]\); rename one/, undefined, { timeout: 20_000 });
    expect(alert).toBeTruthy();
    expect(useAppStore.getState().workspace.curves).toEqual(twice);
    // The default curve still builds and is shown.
    expect(screen.getByRole('table', { name: 'Key maturities' })).toBeTruthy();
  });
});
