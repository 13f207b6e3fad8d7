// The link fuzzer (test/helpers/linkFuzz.ts) in the normal suite: 10,000 random and mutated link
// fragments, fixed seed, through decode, validation and the workbench's document path. No exception
// escapes and every failure is a readable message. The longer run: test/tools/fuzz-links.ts.
import { runLinkFuzz } from '../helpers/linkFuzz.ts';

describe('link fuzzer', () => {
  it('10,000 random and mutated links: nothing throws, every failure reads as a message', async () => {
    const report = await runLinkFuzz(10_000);
    console.info(`link fuzzer: ${report.cases} cases, ${report.opened} opened (${report.readOnly} read-only), ${report.refused} refused with a message`);
    expect(report.cases).toBe(10_000);
    // The generators reach every outcome, so the property is not checked on refusals alone.
    expect(report.opened).toBeGreaterThan(500);
    expect(report.readOnly).toBeGreaterThan(50);
    expect(report.refused).toBeGreaterThan(2000);
  }, 120_000);
});
