// The documents and the app's own ways out and back in that the golden round trips use: the demo
// workspace and the test fixtures, the workspace file (serialiseDocument, parseDocumentText) and
// the link (linkDocument, encodeWorkspaceLink, decodeWorkspaceLink). Kept apart from golden.ts so a
// move of these modules changes only the imports here.
import market40 from '../fixtures/market40/market40.json';
import workbench40 from '../fixtures/share/workbench40.json';
import workspace40 from '../fixtures/share/workspace40.json';
import { DEFAULT_DISPLAY, linkDocument, parseDocumentText, serialiseDocument, type WorkbenchDocument } from '../../src/core/index.ts';
import { analyseRollVsTerm, DEFAULT_STRATEGY, validateStrategy } from '../../src/core/index.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { curveSeries } from '../../src/hooks/useCurveSeries.ts';
import { decodeWorkspaceLink, encodeWorkspaceLink } from '../../src/share/linkCodec.ts';
import { demoWorkspace } from '../../src/state/demoWorkspace.ts';
import { withoutMessages } from './golden.ts';

/** Every document whose file and link round trips the golden check holds, by name. */
export function roundTripDocuments(): Record<string, Record<string, unknown>> {
  let n = 0;
  return {
    demo: demoWorkspace(() => `r${n++}`) as unknown as Record<string, unknown>,
    workbench40: structuredClone(workbench40) as Record<string, unknown>,
    workspace40: structuredClone(workspace40) as Record<string, unknown>,
    market40: structuredClone(market40) as Record<string, unknown>,
  };
}

export const roundTripTools = {
  serialise: serialiseDocument,
  parse: (text: string): Record<string, unknown> | null => {
    const o = parseDocumentText(text);
    return o.ok ? o.value.document : null;
  },
  link: async (doc: Record<string, unknown>): Promise<Record<string, unknown> | null> => {
    const o = await decodeWorkspaceLink(await encodeWorkspaceLink(linkDocument(doc), 'golden-build'), 'golden-build');
    return o.ok ? o.checked.document : null;
  },
};

/**
 * The workbench's own derived figures for a workbench document: its build (deriveBuild, as the
 * charts see it), every charted line (curveSeries) and roll versus term with the default strategy
 * and the document's own, as plain data (functions and curve objects left out, messages blanked).
 */
export function workbenchOutputs(doc: Record<string, unknown>): Record<string, string> {
  const ws = doc as unknown as WorkbenchDocument;
  const result = deriveBuild(ws);
  const plain = (x: unknown): string =>
    JSON.stringify(withoutMessages(JSON.parse(JSON.stringify(x, (_k, v: unknown) => (typeof v === 'function' ? undefined : v !== null && typeof v === 'object' && 'lnDiscountAt' in v ? 'curve' : v)))));
  const out: Record<string, string> = {};
  const curve = result.build.curve;
  out.build = plain({ errors: result.build.errors, warnings: result.build.warnings, repricing: result.build.repricing, rowIssues: result.rowIssues, fatal: result.fatal ?? null, pillars: curve?.pillars ?? null });
  if (!curve) return out;
  out.series = plain(curveSeries(curve, { ...DEFAULT_DISPLAY, ...(ws.display ?? {}), showPar: true }, result.build.repricing));
  const strategies = [DEFAULT_STRATEGY, ...(doc.strategy ? [validateStrategy(doc.strategy).strategy] : [])];
  strategies.forEach((s, k) => {
    out[`roll-${k}`] = plain(analyseRollVsTerm(curve, s));
  });
  return out;
}
