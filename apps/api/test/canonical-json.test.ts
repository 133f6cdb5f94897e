import { describe, expect, it } from 'vitest';
import { canonicalJson } from '@gloaming/db';

describe('canonicalJson', () => {
  it('sorts keys at every depth, keeps array order and drops undefined members', () => {
    expect(canonicalJson({ b: 1, a: [{ d: 2, c: null }, 3], e: undefined })).toBe('{"a":[{"c":null,"d":2},3],"b":1}');
  });

  it('gives equal text for equal content stored in a different key order', () => {
    const one = { sections: [{ id: 's1', name: 'Path', lines: [] }], discount: null, deposit: { kind: 'percent', bp: 3000 } };
    const two = { deposit: { bp: 3000, kind: 'percent' }, discount: null, sections: [{ lines: [], name: 'Path', id: 's1' }] };
    expect(canonicalJson(one)).toBe(canonicalJson(two));
    expect(canonicalJson(one)).not.toBe(canonicalJson({ ...two, deposit: { bp: 3001, kind: 'percent' } }));
  });

  it('escapes strings as JSON does and refuses numbers JSON cannot carry', () => {
    expect(canonicalJson({ 'é"': 'line\nbreak' })).toBe('{"é\\"":"line\\nbreak"}');
    expect(() => canonicalJson({ x: Number.NaN })).toThrow(TypeError);
  });
});
