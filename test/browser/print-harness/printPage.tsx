// Harness page: the printed summary for the fixture workspace, with ?scenarios=N and ?note=longest.
import { createRoot } from 'react-dom/client';
import { applyScenario, type Scenario } from '../../../src/core/index.ts';
import { defaultTableConventions, validateDocument, workspaceHash } from '../../../src/core/index.ts';
import { PrintChart } from '../../../src/features/print/PrintChart.tsx';
import { printKeyRows, printScenarios, scenarioConventionsText } from '../../../src/features/print/printData.ts';
import { PrintSummary } from '../../../src/features/print/PrintSummary.tsx';
import { BUILD_ID } from '../../../src/share/buildId.ts';
import { baseCurve, FIXTURE, LONGEST_NOTE, samples } from './harnessData.ts';
import '../../../src/styles/base.css';

const params = new URLSearchParams(window.location.search);
const extra: Scenario[] = [
  { id: 'kr', name: 'Key-rate 7Y +10 bp', space: 'zero', shape: { kind: 'key-rate', points: [{ at: '5Y', bp: 0 }, { at: '7Y', bp: 10 }, { at: '10Y', bp: 0 }] } },
  { id: 'flat', name: 'Bull flattener', space: 'quotes', shape: { kind: 'twist', short: '2Y', pivot: '2Y', long: '30Y', bp: -25 } },
];
const base = FIXTURE.scenarios as Scenario[];
const count = Number(params.get('scenarios') ?? '3');
const scenarios = [...base, ...extra].slice(0, count);
const noteParam = params.get('note');
// 'wide': the longest note in the widest letter, to check that even the widest 600 printed characters fit.
const doc = { ...FIXTURE, scenarios, note: noteParam === 'longest' ? LONGEST_NOTE : noteParam === 'wide' ? 'W'.repeat(2000) : FIXTURE.note };
const checked = validateDocument(doc);
if (!checked.ok || !checked.value.workspace) throw new Error('harness document does not validate');
const ws = checked.value.workspace;
const curve = baseCurve(doc);
const conv = defaultTableConventions(curve);
const xMax = 30;
const colours = ['#1d5fa6', '#c4581d', '#187a5e', '#8a5a00', '#6b4fa0'];
const scenarioCurves = scenarios.slice(0, 4).flatMap((s, i) => {
  const r = applyScenario(s, ws, curve);
  return r.ok ? [{ label: s.name, colour: colours[i + 1]!, dash: '4 2', curve: r.value.curve }] : [];
});
const series = (kind: 'zero' | 'forward') => [
  { label: 'Base', colour: colours[0]!, points: samples(curve, xMax, kind) },
  ...scenarioCurves.map((c) => ({ label: c.label, colour: c.colour, dash: c.dash, points: samples(c.curve, xMax, kind) })),
];

createRoot(document.getElementById('root')!).render(
  <PrintSummary
    title="Month-end curve review"
    note={doc.note as string}
    settlement={ws.settlement}
    curveDayCount={ws.curve.dayCount}
    interpolation={ws.curve.interpolation}
    extrapolation={ws.curve.extrapolation}
    zeroChart={<PrintChart title="Zero rates" tag={`cont, ${ws.curve.dayCount}`} series={series('zero')} xMax={xMax} />}
    forwardChart={<PrintChart title="Instantaneous forwards" tag={`cont, ${ws.curve.dayCount}`} series={series('forward')} xMax={xMax} />}
    keyRows={printKeyRows(curve, conv)}
    conventions={conv}
    scenarios={printScenarios(scenarios, ws, curve, conv)}
    scenarioConventions={scenarioConventionsText(conv)}
    rollResult={<span>Holding the 5Y for one year beats rolling 1Y deposits by +38.2 bp (break-even 5Y yield rise +9.6 bp); harness text.</span>}
    producedAt={new Date('2026-12-01T22:30:00Z')}
    timeZone="America/Los_Angeles"
    buildId={BUILD_ID}
    workspaceHash={workspaceHash(doc)}
  />,
);
document.body.dataset.ready = 'true';
