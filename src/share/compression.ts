/**
 * Raw DEFLATE (RFC 1951) through the platform's CompressionStream / DecompressionStream (WHATWG
 * Compression Standard; in browsers and in Node 20).
 */

async function collect(readable: ReadableStream<Uint8Array>, cap: number): Promise<{ bytes: Uint8Array } | { tooLarge: true }> {
  const reader = readable.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > cap) {
      reader.cancel().catch(() => undefined);
      return { tooLarge: true };
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    bytes.set(c, at);
    at += c.byteLength;
  }
  return { bytes };
}

function pipe(bytes: Uint8Array, stream: CompressionStream | DecompressionStream): ReadableStream<Uint8Array> {
  const writer = stream.writable.getWriter();
  // Errors surface on the readable side; these promises must not become unhandled rejections.
  writer.write(bytes as Uint8Array<ArrayBuffer>).catch(() => undefined);
  writer.close().catch(() => undefined);
  return stream.readable as ReadableStream<Uint8Array>;
}

export async function deflateRaw(bytes: Uint8Array): Promise<Uint8Array> {
  const r = await collect(pipe(bytes, new CompressionStream('deflate-raw')), Number.MAX_SAFE_INTEGER);
  if ('tooLarge' in r) throw new RangeError('unreachable');
  return r.bytes;
}

export type InflateOutcome = { readonly ok: true; readonly bytes: Uint8Array } | { readonly ok: false; readonly reason: 'too-large' | 'corrupt' };

/**
 * Inflates raw DEFLATE data, counting the output bytes as they stream and stopping as soon as
 * they pass `cap`, so a small input cannot inflate without bound. Never throws.
 */
export async function inflateRawCapped(bytes: Uint8Array, cap: number): Promise<InflateOutcome> {
  try {
    const r = await collect(pipe(bytes, new DecompressionStream('deflate-raw')), cap);
    return 'tooLarge' in r ? { ok: false, reason: 'too-large' } : { ok: true, bytes: r.bytes };
  } catch {
    return { ok: false, reason: 'corrupt' };
  }
}
