import { describe, expect, it } from 'vitest';
import { finding, hasErrors } from '../src/findings';

describe('findings', () => {
  it('hasErrors is true only when an error is present', () => {
    expect(hasErrors([finding('a', 'warning', 'w'), finding('b', 'info', 'i')])).toBe(false);
    expect(hasErrors([finding('a', 'warning', 'w'), finding('c', 'error', 'e')])).toBe(true);
  });
});
