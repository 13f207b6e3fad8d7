// @vitest-environment jsdom
// The printed summary's content: note cut with a marker, at most four scenarios, trace lines.
import fixtureJson from '../fixtures/share/workspace40.json';
import { render, screen } from '@testing-library/react';
import { buildCurve, convexityModelText } from '../../src/core/index.ts';
import type { Scenario } from '../../src/core/index.ts';
import { defaultTableConventions, workspaceHash } from '../../src/core/index.ts';
import { printKeyRows, printScenarios, scenarioConventionsText } from '../../src/features/print/printData.ts';
import { PrintSummary, printedNote, producedAtText, type PrintSummaryProps } from '../../src/features/print/PrintSummary.tsx';

const fixture = fixtureJson as unknown as Record<string, unknown>;
const build = buildCurve(fixture);
const curve = build.curve!;
const ws = build.workspace!;
const conv = defaultTableConventions(curve);
const three = fixture.scenarios as Scenario[];
const six = [...three, ...three.map((s) => ({ ...s, id: `${s.id}b`, name: `${s.name} again` }))];

const props = (over: Partial<PrintSummaryProps> = {}): PrintSummaryProps => ({
  title: 'Review',
  note: fixture.note as string,
  settlement: ws.settlement,
  curveDayCount: ws.curve.dayCount,
  interpolation: ws.curve.interpolation,
  extrapolation: ws.curve.extrapolation,
  zeroChart: <svg aria-label="zero chart" />,
  forwardChart: <svg aria-label="forward chart" />,
  keyRows: printKeyRows(curve, conv),
  conventions: conv,
  scenarios: printScenarios(three, ws, curve, conv),
  scenarioConventions: scenarioConventionsText(conv),
  rollResult: 'Term beats roll by +12.0 bp',
  producedAt: new Date('2026-12-01T22:30:00Z'),
  timeZone: 'Europe/London',
  buildId: 'b-123',
  workspaceHash: workspaceHash(fixture),
  ...over,
});

describe('PrintSummary', () => {
  it('names the futures convexity model with its inputs when one is set, and says nothing of it otherwise', () => {
    const text = convexityModelText({ model: 'hull-white', volatility: 0.01, meanReversion: 0.03 });
    const { unmount } = render(<PrintSummary {...props({ futuresConvexity: text })} />);
    expect(screen.getByText(/futures convexity by the Hull-White \(Kirikos-Novak\) model, \u03c3 1\.0000% a year, a 0\.0300 a year/)).toBeInTheDocument();
    unmount();
    render(<PrintSummary {...props()} />);
    expect(screen.queryByText(/futures convexity/)).toBeNull();
  });
  it('prints the title, settings, both charts, key maturities with their conventions, and the trace', () => {
    render(<PrintSummary {...props()} />);
    const page = screen.getByRole('article', { name: 'Printed summary' });
    expect(page.textContent).toContain('Settlement 2026-11-30');
    expect(screen.getByLabelText('zero chart')).toBeInTheDocument();
    expect(screen.getByLabelText('forward chart')).toBeInTheDocument();
    expect(page.textContent).toContain('Zero (cont, ACT/365F)');
    expect(page.textContent).toContain('Par (s.a., ACT/ACT-ICMA)');
    expect(page.textContent).toContain('Fwd 3M (simple, ACT/360)');
    expect(page.textContent).toMatch(/1 Dec 2026, 22:30 GMT(\+0)? \(Europe\/London\)/);
    expect(page.textContent).toContain('b-123');
    expect(page.textContent).toMatch(/Workspace[0-9a-f]{8}/);
    expect(page.textContent).toContain('Term beats roll by +12.0 bp');
    expect(screen.getByRole('note').textContent).toContain('not investment advice');
  });

  it('cuts the note at 600 characters with a marker', () => {
    const long = 'x'.repeat(1999) + 'END';
    render(<PrintSummary {...props({ note: long })} />);
    expect(screen.getByLabelText('Note').textContent).toBe(`${'x'.repeat(600)} [… note cut at 600 characters]`);
    expect(printedNote('short').cut).toBe(false);
    expect([...printedNote('😀'.repeat(700)).text].length).toBe(600);
  });

  it('prints four scenarios and counts the rest', () => {
    render(<PrintSummary {...props({ scenarios: printScenarios(six, ws, curve, conv) })} />);
    expect(screen.getByText('and 2 more not shown')).toBeInTheDocument();
    expect(screen.getAllByRole('columnheader').filter((h) => /^\d\. /.test(h.textContent ?? '')).map((h) => h.textContent)).toEqual([
      '1. Parallel +25 bp',
      '2. Bear steepener 2s10s +30 bp',
      '3. Belly cheapens',
      '4. Parallel +25 bp again',
    ]);
  });

  it('writes the produced-at time with the named time zone (Intl, tz database)', () => {
    expect(producedAtText(new Date('2026-07-01T12:00:00Z'), 'America/New_York')).toBe('1 Jul 2026, 08:00 GMT-4 (America/New_York)');
  });
});
