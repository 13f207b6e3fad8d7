// isPlainObject: the one test for "a JSON object" (RFC 8259, section 4: an object is a set of
// name/value pairs, distinct from an array, a string, a number, true, false and null).
import { describe, expect, it } from 'vitest';
import { isPlainObject } from '../../../src/core/index.ts';

describe('isPlainObject', () => {
  it('accepts what JSON.parse gives for an object, and nothing JSON.parse gives for the other values', () => {
    expect(isPlainObject(JSON.parse('{}'))).toBe(true);
    expect(isPlainObject(JSON.parse('{"a":[1]}'))).toBe(true);
    for (const text of ['[]', '[{}]', 'null', '"x"', '1', 'true', 'false']) expect(isPlainObject(JSON.parse(text)), text).toBe(false);
    expect(isPlainObject(undefined)).toBe(false);
  });
});
