import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

/** What a run of the `curve` command into a held-back reader measured. */
export interface HeldRun {
  /** The command's exit status. */
  readonly status: number | null;
  /** Its peak resident set size, MB (1 MB = 2^20 bytes). */
  readonly peakMB: number;
  /** Bytes of standard output the reader took. */
  readonly bytesRead: number;
  readonly stderr: string;
}

/** CPU time (user + system) of a process so far, in clock ticks, from /proc (Linux). */
function cpuTicks(pid: number): number | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return Number(fields[11]) + Number(fields[12]); // utime, stime (fields 14 and 15 of proc(5))
  } catch {
    return null;
  }
}

/**
 * Runs `node src/cli/launch.mjs ARGS` (the real command, as npm runs it) with its standard output
 * piped into a reader that reads nothing until the command has stopped using the processor for
 * `idleMs` (a command that respects back-pressure stops as soon as the pipe is full; one that does
 * not goes on building and holding its whole output), then reads everything. Returns the command's
 * peak memory, measured in its own process by test/cli/peakMemory.mjs.
 */
export async function runIntoHeldReader(args: readonly string[], env: Record<string, string>, tmp: string, idleMs = 500): Promise<HeldRun> {
  const peakFile = join(tmp, `peak-${process.pid}-${Date.now()}.txt`);
  const command = spawn(process.execPath, ['--import', './test/cli/peakMemory.mjs', 'src/cli/launch.mjs', ...args], {
    stdio: ['ignore', 'pipe', 'pipe'],
    env: { ...process.env, ...env, TENORSCOPE_PEAK_FILE: peakFile },
  });
  let stderr = '';
  command.stderr.setEncoding('utf8').on('data', (s: string) => (stderr += s));
  // The reader: a child of its own holding the other end of the pipe, released by SIGUSR2.
  const reader = spawn(
    process.execPath,
    [
      '-e',
      "let n = 0; const wait = setInterval(() => {}, 1000); process.on('SIGUSR2', () => process.stdin.on('data', (d) => (n += d.length))); process.stdin.on('end', () => { clearInterval(wait); process.stdout.write(String(n)); });",
    ],
    { stdio: [command.stdout, 'pipe', 'inherit'] },
  );
  command.stdout.destroy(); // the reader holds its own copy of the pipe; this process reads none of it
  let readerOut = '';
  reader.stdout.setEncoding('utf8').on('data', (s: string) => (readerOut += s));
  const readerDone = new Promise<void>((resolve) => reader.on('close', () => resolve()));
  const commandDone = new Promise<number | null>((resolve) => command.on('close', (code) => resolve(code)));
  let exited = false;
  void commandDone.then(() => (exited = true));
  // Wait until the command's CPU time stands still for idleMs (or it has exited), then release the reader.
  let last = -1;
  let still = 0;
  while (!exited) {
    await new Promise((r) => setTimeout(r, 50));
    const t = cpuTicks(command.pid!);
    if (t === null) break;
    still = t === last ? still + 50 : 0;
    last = t;
    if (still >= idleMs) break;
  }
  reader.kill('SIGUSR2');
  const status = await commandDone;
  await readerDone;
  const peakKB = Number(readFileSync(peakFile, 'utf8'));
  return { status, peakMB: peakKB / 1024, bytesRead: Number(readerOut), stderr };
}
