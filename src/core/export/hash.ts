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

/** JSON with object keys sorted at every level, so equal documents give equal text. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map((v) => canonicalJson(v === undefined ? null : v)).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const obj = value as Record<string, unknown>;
    const keys = Object.keys(obj).filter((k) => obj[k] !== undefined).sort();
    return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson(obj[k])}`).join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}

/** The short workspace hash printed on the summary page: first 8 hex digits of FNV-1a 64 of the canonical document. */
export const workspaceHash = (doc: unknown): string => fnv1a64(canonicalJson(doc)).slice(0, 8);
