/**
 * Short, deterministic fingerprints for documents and curves: FNV-1a 64-bit over the UTF-8 bytes
 * of a canonical text (offset basis 0xcbf29ce484222325, prime 0x100000001b3; Fowler, Noll, Vo,
 * the FNV hash as published by its authors, cited from memory). Not a cryptographic hash: it traces
 * a page to its link and notices a changed rebuild, it does not prove anything against tampering.
 */
const OFFSET = 0xcbf29ce484222325n;
const PRIME = 0x100000001b3n;
const MASK = 0xffffffffffffffffn;

function utf8Bytes(text: string): number[] {
  const out: number[] = [];
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    if (cp < 0x80) out.push(cp);
    else if (cp < 0x800) out.push(0xc0 | (cp >> 6), 0x80 | (cp & 63));
    else if (cp < 0x10000) out.push(0xe0 | (cp >> 12), 0x80 | ((cp >> 6) & 63), 0x80 | (cp & 63));
    else out.push(0xf0 | (cp >> 18), 0x80 | ((cp >> 12) & 63), 0x80 | ((cp >> 6) & 63), 0x80 | (cp & 63));
  }
  return out;
}

/** FNV-1a 64-bit of the text's UTF-8 bytes, as 16 lower-case hex digits. */
export function fnv1a64(text: string): string {
  let h = OFFSET;
  for (const b of utf8Bytes(text)) {
    h ^= BigInt(b);
    h = (h * PRIME) & MASK;
  }
  return h.toString(16).padStart(16, '0');
}

/**
 * JSON with object keys sorted at every level, so equal documents give equal text. Built with an
 * explicit stack, not recursion: a structure nested thousands deep (a crafted link) cannot
 * overflow the call stack. Same text as JSON.stringify with sorted keys: undefined object values
 * are left out, undefined list entries and other values JSON cannot write become null.
 */
export function canonicalJson(value: unknown): string {
  const out: string[] = [];
  // Each entry is either text to write as is, or a value still to write.
  const stack: ({ text: string } | { value: unknown })[] = [{ value }];
  while (stack.length > 0) {
    const item = stack.pop()!;
    if ('text' in item) {
      out.push(item.text);
      continue;
    }
    const v = item.value;
    if (Array.isArray(v)) {
      const parts: ({ text: string } | { value: unknown })[] = [{ text: '[' }];
      v.forEach((x, i) => {
        if (i > 0) parts.push({ text: ',' });
        parts.push({ value: x === undefined ? null : x });
      });
      parts.push({ text: ']' });
      for (let i = parts.length - 1; i >= 0; i--) stack.push(parts[i]!);
    } else if (v !== null && typeof v === 'object') {
      const obj = v as Record<string, unknown>;
      const keys = Object.keys(obj).filter((k) => obj[k] !== undefined).sort();
      const parts: ({ text: string } | { value: unknown })[] = [{ text: '{' }];
      keys.forEach((k, i) => {
        parts.push({ text: `${i > 0 ? ',' : ''}${JSON.stringify(k)}:` }, { value: obj[k] });
      });
      parts.push({ text: '}' });
      for (let i = parts.length - 1; i >= 0; i--) stack.push(parts[i]!);
    } else out.push(JSON.stringify(v) ?? 'null');
  }
  return out.join('');
}

/** The short workspace hash printed on the summary page: first 8 hex digits of FNV-1a 64 of the canonical document. */
export const workspaceHash = (doc: unknown): string => fnv1a64(canonicalJson(doc)).slice(0, 8);
