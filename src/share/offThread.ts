/** Texts from this many characters are read in a worker (the paste reader's threshold, src/features/quotes/pasteReader.ts). */
export const WORKER_FROM_CHARS = 64_000;

/**
 * Runs `read(request)` in the given worker when the text it carries is long (`chars`, so the page
 * never freezes on a big file) and on the page when it is short or workers are missing; a worker
 * that fails to start, throws or sends what cannot be read falls back to the page. The worker
 * answers one message (the request); `fromReply` takes the result out of its reply (default: the
 * reply is the result; null: not an answer, read on the page).
 */
export function readOffThread<R, T, P = T>(chars: number, request: R, read: (request: R) => T, startWorker: () => Worker, fromReply: (reply: P) => T | null = (reply) => reply as unknown as T): Promise<T> {
  if (chars < WORKER_FROM_CHARS || typeof Worker === 'undefined') return Promise.resolve(read(request));
  return new Promise<T>((resolve) => {
    let worker: Worker;
    try {
      worker = startWorker();
    } catch {
      resolve(read(request));
      return;
    }
    let settled = false;
    const finish = (result: () => T): void => {
      if (settled) return;
      settled = true;
      worker.terminate();
      resolve(result());
    };
    worker.onmessage = (e: MessageEvent<P>) => {
      const value = fromReply(e.data);
      finish(() => (value === null ? read(request) : value));
    };
    worker.onerror = () => finish(() => read(request));
    worker.onmessageerror = () => finish(() => read(request));
    worker.postMessage(request);
  });
}
