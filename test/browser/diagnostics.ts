// Diagnostics the browser benches print on request (TRACE=1, PROFILE=1): where the main thread's
// time went in a Chromium trace, and which functions a CPU profile found most often on the stack.
// Printed only; nothing here is a target.

/** Main-thread trace events summed by name, per unit of work (`per` units, named `unit`), the 18 largest. */
export function traceSummary(trace: Buffer, per: number, unit: string): string {
  const events = (JSON.parse(trace.toString()) as { traceEvents: { name: string; ph: string; dur?: number; tid: number }[] }).traceEvents;
  const main = events.find((e) => e.name === 'EventDispatch')?.tid;
  const sum = new Map<string, number>();
  for (const e of events) if (e.ph === 'X' && e.dur && e.tid === main) sum.set(e.name, (sum.get(e.name) ?? 0) + e.dur);
  return [...sum].sort((a, b) => b[1] - a[1]).slice(0, 18).map(([k, v]) => `${(v / 1000 / per).toFixed(2)} ms/${unit}  ${k}`).join('\n');
}

export type ProfileNode = { id: number; callFrame: { functionName: string; url: string; lineNumber: number }; hitCount?: number; children?: number[] };

/**
 * Inclusive samples per function (each function counted once per stack), as percentages of all
 * samples, the `top` largest. With `withLine`, functions are told apart by their line as well.
 */
export function profileSummary(nodes: readonly ProfileNode[], top: number, withLine = false): string {
  const byId = new Map(nodes.map((n) => [n.id, n]));
  const incl = new Map<string, number>();
  let total = 0;
  const walk = (n: ProfileNode, seen: Set<string>): void => {
    const name = withLine ? `${n.callFrame.functionName || '(anon)'}:${n.callFrame.lineNumber}` : n.callFrame.functionName || '(anon)';
    const hits = n.hitCount ?? 0;
    total += hits;
    const here = new Set(seen);
    here.add(name);
    for (const k of here) incl.set(k, (incl.get(k) ?? 0) + hits);
    for (const c of n.children ?? []) walk(byId.get(c)!, here);
  };
  walk(nodes[0]!, new Set());
  return [...incl].sort((a, b) => b[1] - a[1]).slice(0, top).map(([k, v]) => `${((100 * v) / total).toFixed(1)}% ${k}`).join('\n');
}
