// The turns and meeting-steps sections travel with the workspace: the workbench document keeps
// them (shape check, engine document, the bridge back from an engine file), the store's edits are
// undone, and a link carries them. Absent, nothing changes (the golden check holds every earlier
// document's numbers). The dates are SOFR's 2022 effective dates (MARKET-CONVENTIONS.md section h).
import { readFileSync } from 'node:fs';
import { checkWorkbenchShape, readTurnLines, readWorkbenchDocument, toEngineDocument, validateWorkspace, workbenchFromEngine, type WorkbenchDocument } from '../../../src/core/index.ts';
import { decodeWorkspaceLink, encodeWorkspaceLink } from '../../../src/share/linkCodec.ts';
import { useAppStore } from '../../../src/state/store.ts';

const workbench = JSON.parse(readFileSync(new URL('../../fixtures/share/workbench40.json', import.meta.url), 'utf8')) as Record<string, unknown>;
const turns = [{ name: 'year end', from: '2027-12-31', to: '2027-12-31', spreadBp: 8 }];
const meetingSteps = { on: false, effectiveDates: ['2027-03-18', '2027-05-06'] };
const withSections = { ...workbench, turns, meetingSteps };

describe('turns and meetingSteps in the workbench document', () => {
  it('checkWorkbenchShape accepts them, toEngineDocument writes them, and the engine reads them back', () => {
    expect(checkWorkbenchShape(withSections).errors).toEqual([]);
    const read = readWorkbenchDocument(withSections, () => 'id');
    expect(read.problem).toBeNull();
    const engine = toEngineDocument(read.doc!).doc;
    expect(engine.turns).toEqual(turns);
    expect(engine.meetingSteps).toEqual(meetingSteps);
    const ws = validateWorkspace(engine).workspace!;
    expect(ws.turns).toEqual(turns);
    expect(ws.meetingSteps).toEqual(meetingSteps);
    const back = workbenchFromEngine(engine, () => 'id');
    expect(back.ok && back.value.turns).toEqual(turns);
    expect(back.ok && back.value.meetingSteps).toEqual(meetingSteps);
  });

  it('absent sections stay absent in the engine document', () => {
    const read = readWorkbenchDocument(workbench, () => 'id');
    const engine = toEngineDocument(read.doc!).doc;
    expect('turns' in engine || 'meetingSteps' in engine).toBe(false);
  });

  it('a malformed shape is refused naming the section', () => {
    expect(checkWorkbenchShape({ ...workbench, turns: 'year end' }).errors.map((e) => e.path)).toEqual(['turns']);
    expect(checkWorkbenchShape({ ...workbench, meetingSteps: { on: true, dates: [] } }).errors.map((e) => e.path)).toEqual(['meetingSteps']);
  });

  it('a link carries them', async () => {
    const outcome = await decodeWorkspaceLink(await encodeWorkspaceLink(withSections));
    expect(outcome.ok && outcome.checked.document).toEqual(withSections);
  });

  it('setTurns and setMeetingSteps are one undoable step each', () => {
    const s = () => useAppStore.getState();
    const before = s().workspace;
    s().setTurns(turns);
    expect(s().workspace.turns).toEqual(turns);
    s().setMeetingSteps(meetingSteps);
    expect((s().workspace as WorkbenchDocument).meetingSteps).toEqual(meetingSteps);
    s().undo();
    expect(s().workspace.meetingSteps).toBeUndefined();
    s().undo();
    expect(s().workspace).toBe(before);
    s().setTurns([]);
    expect('turns' in s().workspace).toBe(false);
  });
});

// The pasted turn lines' format is the README's ("first day, last day, spread in bp, name").
describe('readTurnLines', () => {
  it('reads each line, in the sheet\'s date order, and names every line not taken with what is wrong', () => {
    const r = readTurnLines('2027-12-31, 2027-12-31, 10, year end\n\n31/03/2027\t31/03/2027\t\u22122.5\nsoon, 2027-06-30, 5\n2027-06-30, 2027-06-29, 5\n2027-06-30; 2027-06-30; 2000', 'dmy');
    expect(r.turns).toEqual([
      { name: 'year end', from: '2027-12-31', to: '2027-12-31', spreadBp: 10 },
      { name: 'turn 2027-03-31', from: '2027-03-31', to: '2027-03-31', spreadBp: -2.5 },
    ]);
    expect(r.problems.map((p) => [p.line, p.message])).toEqual([
      [4, 'the first day "soon" is not a date (use YYYY-MM-DD)'],
      [5, 'the last day 2027-06-29 is before the first 2027-06-30'],
      [6, 'the spread "2000" must be a number of bp from -1000 to 1000'],
    ]);
  });

  it('reads the spread with the sheet\'s decimal comma, and refuses a comma-parted line then rather than misread 7,5 as 7', () => {
    const r = readTurnLines('2027-12-31; 2027-12-31; 7,5; year end, as agreed\n31 Dec 2027\t31 Dec 2027\t\u22122,25\n2027-12-31, 2027-12-31, 7,5, year end', 'dmy', ',');
    expect(r.turns).toEqual([
      { name: 'year end, as agreed', from: '2027-12-31', to: '2027-12-31', spreadBp: 7.5 },
      { name: 'turn 2027-12-31', from: '2027-12-31', to: '2027-12-31', spreadBp: -2.25 },
    ]);
    expect(r.problems.map((p) => p.line)).toEqual([3]);
    expect(r.problems[0]!.message).toMatch(/with the decimal comma, part the fields by tabs or semicolons/);
  });
});
