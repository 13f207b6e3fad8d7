import { canonicalJson, fnv1a64, workspaceHash } from '../../../src/core/index.ts';

describe('fnv1a64(text)', () => {
  it('matches the published FNV-1a 64-bit test vectors (FNV reference test suite, cited from memory)', () => {
    expect(fnv1a64('')).toBe('cbf29ce484222325');
    expect(fnv1a64('a')).toBe('af63dc4c8601ec8c');
    expect(fnv1a64('foobar')).toBe('85944171f73967e8');
  });
  it('hashes UTF-8 bytes, not UTF-16 units', () => {
    expect(fnv1a64('é')).not.toBe(fnv1a64('\u00e9'.normalize('NFD')));
  });
});

describe('workspaceHash(doc)', () => {
  it('ignores key order and changes with any value', () => {
    expect(canonicalJson({ b: 1, a: [1, { d: 2, c: 3 }] })).toBe('{"a":[1,{"c":3,"d":2}],"b":1}');
    expect(workspaceHash({ a: 1, b: 2 })).toBe(workspaceHash({ b: 2, a: 1 }));
    expect(workspaceHash({ a: 1, b: 2 })).not.toBe(workspaceHash({ a: 1, b: 3 }));
    expect(workspaceHash({ a: 1 })).toMatch(/^[0-9a-f]{8}$/);
  });
});
