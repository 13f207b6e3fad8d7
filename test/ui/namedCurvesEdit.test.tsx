// @vitest-environment jsdom
// Adding, changing and removing named curves and editing their quotes in the workbench (issue 18
// items 8 and 10): each change is one undo step and touches nothing else in the workspace; each
// refusal sits on its field, naming what to change; the edited curves come back exactly from the
// saved file, the link and the browser's saved entry. The rules are the document's (README
// "Several curves"); the fixture is the command line's invented test document
// (test/fixtures/namedCurves/SOURCE.md).
import { act, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { runCurveCommand } from '../../src/cli/curveCommand.ts';
import { buildWorkbenchCurves, parseRow, readWorkbenchDocument, serialiseDocument, zeroOn, type WorkbenchDocument } from '../../src/core/index.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { decodeWorkspaceLink, encodeWorkspaceLinkChecked } from '../../src/share/linkCodec.ts';
import { parseDocumentText } from '../../src/share/documentReader.ts';
import { checkRestoredWorkspace } from '../../src/state/restoreCheck.ts';
import { useAppStore } from '../../src/state/store.ts';
import { openWorkspaceFile, TWO_CURVES } from '../helpers/engineWorkspace.ts';

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const FIXTURE = TWO_CURVES;
const initial = useAppStore.getInitialState();
const open = openWorkspaceFile;
const ws = () => useAppStore.getState().workspace;
const named = () => ws().curves as Record<string, unknown>[] | undefined;
/** Everything in the workspace but its named curves and view (what a curve edit must leave alone). */
const rest = (doc: WorkbenchDocument) => {
  const { curves: _c, view: _v, ...others } = doc;
  return others;
};
const user = () => userEvent.setup({ delay: null });

beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

describe('adding, changing and removing curves', () => {
  it('adds a first named curve to a workspace of one curve, refusing an empty name on its field; undo leaves one curve', async () => {
    const u = user();
    render(<App />);
    const before = ws();
    await u.click(screen.getByRole('button', { name: 'Add a named curve' }));
    const form = await screen.findByRole('form', { name: 'Add a named curve' }, { timeout: 20_000 });
    await u.click(within(form).getByRole('button', { name: 'Add the curve' }));
    const name = within(form).getByRole('textbox', { name: /^Name/ });
    expect(name.getAttribute('aria-invalid')).toBe('true');
    expect(within(form).getByText('Give the curve a name, such as "euribor3m"').id).toBe(name.getAttribute('aria-describedby'));
    expect(ws()).toBe(before);
    await u.type(name, 'govt2');
    await u.selectOptions(within(form).getByRole('combobox', { name: 'Role' }), 'government');
    await u.click(within(form).getByRole('button', { name: 'Add the curve' }));
    expect(named()).toEqual([{ name: 'govt2', role: 'government', curve: { interpolation: 'monotone-convex' }, quotes: [] }]);
    expect(ws().view).toMatchObject({ shownCurve: 'govt2' });
    expect(rest(ws())).toEqual(rest(before));
    expect((screen.getByRole('combobox', { name: 'Curve shown' }) as HTMLSelectElement).value).toBe('govt2');
    act(() => useAppStore.getState().undo());
    expect(ws().curves).toBeUndefined();
    expect(ws()).toEqual(before);
    expect(screen.getByRole('button', { name: 'Add a named curve' })).toBeTruthy();
  });

  it('refuses a name used twice, a projection curve without a discounting curve and a circle on their fields, changing nothing; renames a curve with the view following', async () => {
    const u = user();
    open();
    render(<App />);
    const picker = await screen.findByRole('combobox', { name: 'Curve shown' }, { timeout: 20_000 });
    const start = ws();
    await u.click(screen.getByRole('button', { name: 'Add a curve' }));
    let form = screen.getByRole('form', { name: 'Add a named curve' });
    await u.type(within(form).getByRole('textbox', { name: /^Name/ }), 'govt');
    await u.selectOptions(within(form).getByRole('combobox', { name: 'Role' }), 'projection');
    await u.selectOptions(within(form).getByRole('combobox', { name: /^Discounted on/ }), '');
    await u.click(within(form).getByRole('button', { name: 'Add the curve' }));
    expect(within(form).getByText('"govt" is used by another curve; choose another name')).toBeTruthy();
    expect(within(form).getByText('A projection curve needs a discounting curve: choose one')).toBeTruthy();
    expect(within(form).getByRole('combobox', { name: /^Discounted on/ }).getAttribute('aria-invalid')).toBe('true');
    expect(ws()).toBe(start);
    // A curve on euribor6m, then euribor6m discounted on it: a circle, named on the field.
    const nameBox = within(form).getByRole('textbox', { name: /^Name/ });
    await u.clear(nameBox);
    await u.type(nameBox, 'euribor3m');
    await u.selectOptions(within(form).getByRole('combobox', { name: /^Discounted on/ }), 'euribor6m');
    await u.click(within(form).getByRole('button', { name: 'Add the curve' }));
    expect(named()!.map((c) => c.name)).toEqual(['euribor6m', 'govt', 'euribor3m']);
    await u.selectOptions(picker, 'euribor6m');
    await u.click(screen.getByRole('button', { name: 'Change euribor6m' }));
    form = screen.getByRole('form', { name: 'Change the curve euribor6m' });
    await u.selectOptions(within(form).getByRole('combobox', { name: /^Discounted on/ }), 'euribor3m');
    const beforeCircle = ws();
    await u.click(within(form).getByRole('button', { name: 'Save the curve' }));
    expect(within(form).getByText(/^The curves "euribor6m" -> "euribor3m" -> "euribor6m" would need each other in a circle/)).toBeTruthy();
    expect(ws()).toBe(beforeCircle);
    // Renamed instead: the curve on it and the view follow.
    await u.selectOptions(within(form).getByRole('combobox', { name: /^Discounted on/ }), 'default');
    const box = within(form).getByRole('textbox', { name: /^Name/ });
    await u.clear(box);
    await u.type(box, 'ibor6m');
    await u.click(within(form).getByRole('button', { name: 'Save the curve' }));
    expect(named()!.map((c) => [c.name, c.discountCurve])).toEqual([
      ['ibor6m', 'default'],
      ['govt', undefined],
      ['euribor3m', 'ibor6m'],
    ]);
    expect(named()![0]!.quotes).toEqual(FIXTURE.curves[0]!.quotes);
    expect(ws().view).toMatchObject({ shownCurve: 'ibor6m' });
    expect((picker as HTMLSelectElement).value).toBe('ibor6m');
    expect(rest(ws())).toEqual(rest(start));
    act(() => useAppStore.getState().undo());
    expect(named()!.map((c) => c.name)).toEqual(['euribor6m', 'govt', 'euribor3m']);
  });

  it('removes a curve nothing needs at once (undo brings it back); one others need says which and removes them only when asked', async () => {
    const u = user();
    const start = open();
    const withIndex = [...(start.curves as object[]), { name: 'euribor3m', role: 'projection', index: '3M', discountCurve: 'euribor6m', quotes: [] }];
    act(() => useAppStore.getState().commit({ ...start, curves: withIndex }, 'a third curve'));
    render(<App />);
    const picker = await screen.findByRole('combobox', { name: 'Curve shown' }, { timeout: 20_000 });
    await u.selectOptions(picker, 'govt');
    await u.click(screen.getByRole('button', { name: 'Remove govt' }));
    expect(named()!.map((c) => c.name)).toEqual(['euribor6m', 'euribor3m']);
    act(() => useAppStore.getState().undo());
    expect(named()).toEqual(withIndex);
    await u.selectOptions(picker, 'euribor6m');
    const held = ws();
    await u.click(screen.getByRole('button', { name: 'Remove euribor6m' }));
    expect(ws()).toBe(held);
    const alert = screen.getByText(/"euribor3m" needs the curve "euribor6m" \(discounted on it, or a basis swap against it\): change that first, or remove them too/);
    await u.click(within(alert.closest('div')!).getByRole('button', { name: 'Remove euribor6m and "euribor3m"' }));
    expect(named()!.map((c) => c.name)).toEqual(['govt']);
    act(() => useAppStore.getState().undo());
    expect(named()).toEqual(withIndex);
    // The prompt keeps the curve it was opened for: another curve picked meanwhile is not the one removed.
    await u.click(screen.getByRole('button', { name: 'Remove euribor6m' }));
    await u.selectOptions(picker, 'govt');
    const again = screen.getByText(/"euribor3m" needs the curve "euribor6m"/);
    await u.click(within(again.closest('div')!).getByRole('button', { name: 'Remove euribor6m and "euribor3m"' }));
    expect(named()!.map((c) => c.name)).toEqual(['govt']);
  });
});

describe("editing a named curve's quotes", () => {
  it('edits a row whole with the sheet\'s reader (an FRA\'s start x end), refuses a wrong cell on its field, adds and deletes rows; each one undo step', async () => {
    const u = user();
    open();
    render(<App />);
    await u.selectOptions(await screen.findByRole('combobox', { name: 'Curve shown' }, { timeout: 20_000 }), 'euribor6m');
    const start = ws();
    await u.click(screen.getByRole('button', { name: 'Edit euribor6m quote 1' }));
    let form = screen.getByRole('form', { name: 'Quote 1 of euribor6m' });
    const cell = (label: RegExp) => within(form).getByRole('textbox', { name: label });
    expect((cell(/^Kind/) as HTMLInputElement).value).toBe('deposit');
    expect((cell(/^Maturity/) as HTMLInputElement).value).toBe('6M');
    await u.clear(cell(/^Kind/));
    await u.type(cell(/^Kind/), 'fra');
    await u.clear(cell(/^Maturity/));
    await u.type(cell(/^Maturity/), '6x');
    await u.clear(cell(/^Day count/));
    await u.click(within(form).getByRole('button', { name: 'Apply' }));
    const wrong = parseRow({ id: '', enabled: true, kind: 'fra', maturity: '6x', rate: '0.0247', price: '', coupon: '', frequency: '', dayCount: '', terms: '' }, 'decimal').issues.maturity!.message;
    expect(within(form).getByText(wrong)).toBeTruthy();
    expect(cell(/^Maturity/).getAttribute('aria-invalid')).toBe('true');
    expect(ws()).toBe(start);
    await u.type(cell(/^Maturity/), '12');
    await u.click(within(form).getByRole('button', { name: 'Apply' }));
    expect(named()![0]!.quotes).toEqual([{ kind: 'fra', period: '6x12', rate: 0.0247 }, ...(FIXTURE.curves[0]!.quotes as object[]).slice(1)]);
    expect(named()![1]).toBe(start.curves![1]);
    expect(rest(ws())).toEqual(rest(start));
    // Its row now says what it builds and what discounted it.
    const table = screen.getByRole('table', { name: 'Quotes of the curve euribor6m' });
    expect([...within(table).getAllByRole('row')[1]!.querySelectorAll('td')].map((c) => c.textContent).slice(1, 2)).toEqual(['fra']);
    // A quote added: a basis swap against the default curve.
    await u.click(screen.getByRole('button', { name: 'Add a quote to euribor6m' }));
    form = screen.getByRole('form', { name: 'New quote of euribor6m' });
    await u.type(cell(/^Kind/), 'swap');
    await u.type(cell(/^Maturity/), '5Y');
    await u.type(cell(/^Rate/), '0.0015');
    await u.selectOptions(within(form).getByRole('combobox', { name: 'Basis swap against' }), 'default');
    await u.click(within(form).getByRole('button', { name: 'Add the quote' }));
    expect(named()![0]!.quotes).toHaveLength(4);
    expect((named()![0]!.quotes as object[])[3]).toEqual({ kind: 'swap', tenor: '5Y', rate: 0.0015, against: 'default' });
    await u.click(screen.getByRole('button', { name: 'Delete euribor6m quote 2' }));
    expect((named()![0]!.quotes as { tenor?: string }[]).map((q) => q.tenor)).toEqual([undefined, '10Y', '5Y']);
    // The edited curves come back exactly from the saved file, the link and the browser's saved entry.
    const edited = named();
    const file = parseDocumentText(serialiseDocument(ws() as unknown as Record<string, unknown>));
    if (!file.ok) throw new Error(file.errors[0]!.message);
    expect(readWorkbenchDocument(file.value.document, () => 'x').doc!.curves).toEqual(edited);
    const link = await encodeWorkspaceLinkChecked(ws() as unknown as Record<string, unknown>);
    if (!link.ok) throw new Error(link.message);
    const back = await decodeWorkspaceLink(link.fragment);
    if (!back.ok) throw new Error(back.message);
    expect(back.checked.document.curves).toEqual(edited);
    expect(checkRestoredWorkspace(JSON.parse(JSON.stringify(ws()))).doc!.curves).toEqual(edited);
    // The curve command reads the saved file to the same curves as the workbench builds, to the bit.
    const saved = serialiseDocument(ws() as unknown as Record<string, unknown>);
    const out = JSON.parse((await runCurveCommand(['-'], () => saved)).stdout.trim()) as { curves: Record<string, { points: { date: string; discount: number }[] }> };
    const built = buildWorkbenchCurves(ws(), deriveBuild(ws()).build.curve);
    expect(built.curves.map((c) => c.name)).toEqual(['euribor6m', 'govt']);
    for (const c of built.curves) {
      const points = out.curves[c.name]!.points;
      expect(points.length).toBeGreaterThan(1);
      for (const p of points) {
        const z = zeroOn(c.build.curve!, p.date, 'continuous', 'ACT/365F');
        expect(z.ok && z.value.discount).toBe(p.discount);
      }
    }
    // Three undo steps back to the file's curves.
    for (let i = 0; i < 3; i++) act(() => useAppStore.getState().undo());
    expect(named()).toEqual(FIXTURE.curves);
  });
});
