// A workbench file or link whose turn is written with the engine document's `solveFrom` (a position
// in `quotes`) instead of the workbench's row reference (`solveFromRow`): in a workbench document
// `quotes` are the sheet's rows, so the position is read as that row, which the engine then finds
// wherever its quote sits; a position naming no row, or given beside `solveFromRow`, is refused
// naming the turn and what to write, and the workspace shown is left as it was.
// Market: three deposits made from a flat 4% forward (ACT/365F, continuous) and a 25 bp year-end
// turn over 3 days (weekends calendar), the hand calculation of test/core/bootstrap/turnSolve.test.ts
// (the turn model of the project's market-conventions notes, section h: J = exp(-s d / 360); a
// deposit pays 1 + r days/360). Invented rates.
import { buildCurve, checkWorkbenchShape, OVERNIGHT_KIT, readWorkbenchDocument, toEngineDocument, turnSpreads, workbenchFromEngine, type WorkbenchDocument } from '../../../src/core/index.ts';
import { decodeWorkspaceLink, encodeWorkspaceLink } from '../../../src/share/linkCodec.ts';
import { expectClose } from '../../helpers/asserts.ts';
import { INVENTED_2022_YEAR_END_DEPOSITS } from '../../helpers/markets.ts';

const ENGINE = { ...INVENTED_2022_YEAR_END_DEPOSITS, turns: [{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: 10, calendar: 'weekends' }] };
const TURN = { name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', calendar: 'weekends' };

/** A workbench file as a person might write it: an empty first row, then the three deposits, the turn solved by position. */
function file(turn: Record<string, unknown>): Record<string, unknown> {
  let n = 0;
  const wb = workbenchFromEngine(ENGINE, () => `r${n++}`);
  if (!wb.ok) throw new Error('market');
  const empty = { ...wb.value.quotes[0]!, id: 'blank', kind: '', maturity: '', rate: '' };
  return JSON.parse(JSON.stringify({ ...wb.value, quotes: [empty, ...wb.value.quotes], turns: [turn] })) as Record<string, unknown>;
}

describe('a workbench file whose turn gives solveFrom', () => {
  it('is read as the row at that position of its quotes: the engine solves from the 1M deposit and finds the 25 bp the quotes were made with', () => {
    const raw = file({ ...TURN, solveFrom: 2 });
    expect(checkWorkbenchShape(raw).errors).toEqual([]);
    const read = readWorkbenchDocument(raw, () => 'new');
    expect(read.changes).toEqual([]);
    expect(read.doc!.turns).toEqual([{ ...TURN, solveFromRow: 'r1' }]);
    // The blank row gives no quote, so the engine's position of row r1's deposit is 1, not 2.
    const engine = toEngineDocument(read.doc as WorkbenchDocument).doc;
    expect(engine.turns).toEqual([{ ...TURN, solveFrom: 1 }]);
    const b = buildCurve(engine, { overnight: OVERNIGHT_KIT });
    expect(b.errors).toEqual([]);
    expectClose(turnSpreads(b)[0]!.spreadBp, 25, 1e-9, 'the 25 bp turn the deposits were made with (turnSolve.test.ts hand calculation)');
  });

  it('keeps a spread given beside the position, as the workbench keeps one beside a row', () => {
    const read = readWorkbenchDocument(file({ ...TURN, spreadBp: 10, solveFrom: 3 }), () => 'new');
    expect(read.doc!.turns).toEqual([{ ...TURN, spreadBp: 10, solveFromRow: 'r2' }]);
  });

  const REFUSED: readonly [string, unknown, Record<string, unknown>, RegExp][] = [
    ['a position past the rows', 9, {}, /solveFrom 9 is no row of quotes \(4 rows, from 0\)/],
    ['null', null, {}, /solveFrom null is no row of quotes/],
    ['a fraction', 1.5, {}, /solveFrom 1\.5 is no row of quotes/],
    ['a negative position', -1, {}, /solveFrom -1 is no row of quotes/],
    ['a position beside solveFromRow', 1, { solveFromRow: 'r1' }, /gives both solveFrom and solveFromRow/],
  ];
  for (const [what, q, extra, message] of REFUSED) {
    it(`${what}: refused naming the turn and what to write, by the file check and the link reader`, async () => {
      const raw = file({ ...TURN, solveFrom: q, ...extra });
      const errors = checkWorkbenchShape(raw).errors;
      expect(errors.map((e) => e.path)).toEqual(['turns[0].solveFrom']);
      expect(errors[0]!.message).toMatch(message);
      expect(errors[0]!.message).toMatch(/^turns\[0\] \(year end 2022\) .*: write solveFromRow, the id of the row whose quote sets the spread, or spreadBp$/);
      const linked = await decodeWorkspaceLink(await encodeWorkspaceLink(raw));
      expect(linked.ok).toBe(false);
      if (!linked.ok) expect(linked.message).toMatch(/turns\[0\] \(year end 2022\)/);
    });
  }
});
