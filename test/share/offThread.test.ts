import { describe, expect, it, vi } from 'vitest';
import { readOffThread, WORKER_FROM_CHARS } from '../../src/share/offThread.ts';

// readOffThread: a long text is read in the worker it is given (the worker's answer is the
// result), a short one on the page, and a worker that fails falls back to the page, so a file is
// never lost to a worker that cannot start. A fake Worker stands in for the browser's (jsdom and
// Node have none); the browser test test/browser/capsAndUnknowns.test.ts sees the real one start.
class FakeWorker {
  onmessage: ((e: MessageEvent) => void) | null = null;
  onerror: (() => void) | null = null;
  onmessageerror: (() => void) | null = null;
  terminated = false;
  constructor(private readonly answer: (request: unknown) => unknown, private readonly fail = false) {}
  postMessage(request: unknown): void {
    queueMicrotask(() => (this.fail ? this.onerror?.() : this.onmessage?.({ data: this.answer(request) } as MessageEvent)));
  }
  terminate(): void {
    this.terminated = true;
  }
}

describe('readOffThread', () => {
  it('reads a long text in the worker and takes its answer; a short one on the page', async () => {
    vi.stubGlobal('Worker', FakeWorker);
    try {
      const long = 'x'.repeat(WORKER_FROM_CHARS);
      const worker = new FakeWorker((r) => `worker read ${(r as string).length}`);
      const start = vi.fn(() => worker as unknown as Worker);
      const read = vi.fn((t: string) => `page read ${t.length}`);
      expect(await readOffThread(long.length, long, read, start)).toBe(`worker read ${WORKER_FROM_CHARS}`);
      expect(start).toHaveBeenCalledTimes(1);
      expect(read).not.toHaveBeenCalled();
      expect(worker.terminated).toBe(true);
      expect(await readOffThread(10, 'short text', read, start)).toBe('page read 10');
      expect(start).toHaveBeenCalledTimes(1);
    } finally {
      vi.unstubAllGlobals();
    }
  });

  it('falls back to the page when the worker fails or cannot start, and when there are no workers', async () => {
    const long = 'y'.repeat(WORKER_FROM_CHARS + 1);
    const read = (t: string): string => `page read ${t.length}`;
    vi.stubGlobal('Worker', FakeWorker);
    try {
      expect(await readOffThread(long.length, long, read, () => new FakeWorker(() => 'never', true) as unknown as Worker)).toBe(`page read ${long.length}`);
      expect(
        await readOffThread(long.length, long, read, () => {
          throw new Error('blocked by the content security policy');
        }),
      ).toBe(`page read ${long.length}`);
    } finally {
      vi.unstubAllGlobals();
    }
    expect(typeof Worker).toBe('undefined');
    expect(await readOffThread(long.length, long, read, () => new FakeWorker(() => 'never') as unknown as Worker)).toBe(`page read ${long.length}`);
  });
});
