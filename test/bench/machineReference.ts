// A fixed reference workload, timed alongside the benchmarks so that a reader can tell how fast
// the machine ran while they did. Measured on the 2-core machine kind this project is developed
// on: about 30 to 33 us at full speed; the same machine also runs for seconds to minutes at a time
// in slower states (about 50 us, at times 75 us: other work on the host), and every benchmark
// figure moves with it by roughly the same factor. Not a target: printed for context only.

/** Median time in microseconds of 6,000 exp and sqrt evaluations, over 500 runs after 200 warm-up runs. */
export function machineReferenceMicros(): number {
  let sink = 0;
  const once = (): number => {
    const t0 = performance.now();
    for (let i = 0; i < 6000; i++) sink += Math.exp(-i * 1e-6) * Math.sqrt(i);
    return (performance.now() - t0) * 1000;
  };
  for (let i = 0; i < 200; i++) once();
  const xs: number[] = [];
  for (let i = 0; i < 500; i++) xs.push(once());
  xs.sort((a, b) => a - b);
  if (!Number.isFinite(sink)) throw new Error('reference workload overflowed');
  return xs[xs.length >> 1]!;
}

/** The line both benchmarks print under their tables. */
export const machineReferenceLine = (): string =>
  `machine reference (not a target): ${machineReferenceMicros().toFixed(1)} us for a fixed loop; about 30 to 33 us at this machine kind's full speed (more when the host slows it, and the figures above move with it)`;
