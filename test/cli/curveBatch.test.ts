// A batch of one market at other quotes (the command keeps one CurveBuilder for its run, so every
// document after the first re-quotes the first one's compiled instruments): each output line must
// be the line the same document gives alone. The market is the committed, invented market40
// fixture; the oracle is the command itself on one document (a consistency check).
import market40 from '../fixtures/market40/market40.json';
import { runCurveCommand } from '../../src/cli/curveCommand.ts';

type QuoteDoc = Record<string, unknown>;

/** market40 with every quoted value moved by a step that depends on the document's position k. */
function atOtherQuotes(k: number): Record<string, unknown> {
  const quotes = (market40.quotes as QuoteDoc[]).map((q, i) => {
    const out = { ...q };
    if (typeof q.rate === 'number') out.rate = q.rate + 0.00007 * (((i + k) % 5) - 2);
    if (typeof q.cleanPrice === 'number') out.cleanPrice = q.cleanPrice + 0.03 * (((i + k) % 7) - 3);
    return out;
  });
  return { ...market40, quotes };
}

describe('runCurveCommand on a batch of one market', () => {
  it.each([[[] as string[]], [['--at', '2Y,7Y,30Y', '--forward', '1Y:2Y', '--compounding', 'annual']], [['--skip-invalid', '--extrapolate', 'flat-forward']]])(
    'each line equals the document run alone (%j)',
    async (args) => {
      const docs = Array.from({ length: 6 }, (_, k) => JSON.stringify(k === 3 ? market40 : atOtherQuotes(k)));
      // A document of another structure in the middle (a maturity moved) compiles afresh, and the next re-quotes again.
      docs.splice(4, 0, JSON.stringify({ ...market40, quotes: (market40.quotes as QuoteDoc[]).map((q, i) => (i === 2 ? { ...q, tenor: '4M' } : q)) }));
      const batch = await runCurveCommand(['-', ...args], () => docs.join('\n') + '\n');
      expect(batch.status).toBe(0);
      const lines = batch.stdout.trim().split('\n');
      expect(lines).toHaveLength(docs.length);
      for (let k = 0; k < docs.length; k++) {
        const alone = await runCurveCommand(['-', ...args], () => docs[k]! + '\n');
        expect(lines[k], `document ${k}`).toBe(alone.stdout.trim().replace(/^\{"index":0,/, `{"index":${k},`));
      }
    },
  );
});
