import { describe, expect, it } from 'vitest';
import { AcceptInviteRequest, SignInRequest } from '../src';

describe('auth contracts', () => {
  it('normalises the e-mail before validating it', () => {
    expect(SignInRequest.parse({ email: '  Harriet@Example.COM ', password: 'x' }).email).toBe('harriet@example.com');
  });

  it('names the failing field for a malformed e-mail and a missing password', () => {
    const result = SignInRequest.safeParse({ email: 'not-an-address', password: '' });
    expect(result.success).toBe(false);
    const paths = result.error!.issues.map((i) => i.path.join('.')).sort();
    expect(paths).toEqual(['email', 'password']);
  });

  it('refuses a short new password and a token with odd characters', () => {
    const result = AcceptInviteRequest.safeParse({ token: '../../etc/passwd/aaaaaaaaaaaaaaaaaa', password: 'short' });
    expect(result.success).toBe(false);
    expect(result.error!.issues.map((i) => i.path[0]).sort()).toEqual(['password', 'token']);
  });
});
