import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { arrayJsonText, storedJsonText, toJsonText, withJsonText } from '../src/http/json-text';

/**
 * Responses built around stored JSON text must read back exactly as the whole value would
 * have been serialised: any member values, an empty rest, arrays of pieces.
 */
describe('JSON text pieces', () => {
  it('sets one member to stored text: parses to the same value as the whole object', () => {
    fc.assert(
      fc.property(
        fc.dictionary(
          fc.string().filter((k) => k !== 'doc'),
          fc.jsonValue(),
        ),
        fc.jsonValue(),
        (rest, doc) => {
          type Whole = Record<string, unknown> & { doc: unknown };
          const text = withJsonText<Whole, 'doc'>(rest, 'doc', storedJsonText(JSON.stringify(doc)));
          expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify({ ...rest, doc })));
        },
      ),
    );
  });

  it('handles an empty rest and arrays of pieces', () => {
    const items = [toJsonText<unknown>({ a: 1 }), toJsonText<unknown>({ b: [2, 3] })];
    const text = withJsonText<{ list: unknown[] }, 'list'>({}, 'list', arrayJsonText(items));
    expect(text).toBe('{"list":[{"a":1},{"b":[2,3]}]}');
    expect(arrayJsonText([])).toBe('[]');
  });
});
