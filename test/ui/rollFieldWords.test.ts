import { fieldLabel, inFieldWords } from '../../src/features/roll/fieldWords.ts';
import { buildCurve } from '../../src/core/index.ts';
import { analyseRollVsTerm, DEFAULT_STRATEGY } from '../../src/core/index.ts';
import { toEngineDocument } from '../../src/core/index.ts';
import { demoWorkspace } from '../../src/state/demoWorkspace.ts';

describe('roll-versus-term messages in field words', () => {
  it('inFieldWords(message) names fields by their labels, not by document paths', () => {
    expect(inFieldWords('strategy.horizon: more than 2000 roll legs')).toBe('Horizon: more than 2000 roll legs');
    expect(inFieldWords('strategy.path.legs: must be a list')).toBe('Your path, leg by leg: must be a list');
    expect(fieldLabel('strategy.path.somethingNew')).toBe('something new');
  });

  it("leaves no strategy.* path in the core's own message for a riding bond maturing before the horizon (invented demo market)", () => {
    let n = 0;
    const curve = buildCurve(toEngineDocument(demoWorkspace(() => `r${n++}`)).doc, { skipInvalid: true }).curve!;
    const r = analyseRollVsTerm(curve, { ...DEFAULT_STRATEGY, horizon: '5Y', ridingMaturity: '2Y' });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const said = r.errors.map((e) => inFieldWords(e.message)).join(' ');
    expect(r.errors.map((e) => e.message).join(' ')).toMatch(/strategy\./);
    expect(said).not.toMatch(/strategy\./);
    expect(said).toMatch(/^Riding bond maturity: /);
  });
});
