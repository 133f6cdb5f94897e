import { describe, expect, it } from 'vitest';
import { requireRole, requireUser } from '../src/app/route-guards';
import { createQueryClient } from '../src/lib/query-client';
import { json, OWNER, problem, stubFetch } from './fetch-stub';

async function redirectOf(promise: Promise<unknown>): Promise<string | null> {
  const thrown = await promise.then(
    () => undefined,
    (reason: unknown) => reason,
  );
  expect(thrown).toBeInstanceOf(Response);
  return (thrown as Response).headers.get('Location');
}

describe('route guards', () => {
  it('sends a signed-out visitor to sign in, remembering where they were going', async () => {
    stubFetch(() => problem(401, { title: 'Not signed in', detail: 'Sign in to continue.' }));
    const location = await redirectOf(requireUser(createQueryClient(), new Request('http://gloaming.test/jobs?site=12')));
    expect(location).toBe(`/sign-in?next=${encodeURIComponent('/jobs?site=12')}`);
  });

  it('sends an installer who opens the overview to their own home', async () => {
    stubFetch(() => json(200, { user: { ...OWNER, role: 'installer' } }));
    const location = await redirectOf(requireRole(createQueryClient(), new Request('http://gloaming.test/overview'), ['owner']));
    expect(location).toBe('/jobs');
  });

  it('lets an owner through and asks the api only once for the session', async () => {
    const { fetchMock } = stubFetch(() => json(200, { user: OWNER }));
    const queryClient = createQueryClient();
    const request = new Request('http://gloaming.test/overview');

    await expect(requireRole(queryClient, request, ['owner'])).resolves.toMatchObject({ role: 'owner' });
    await expect(requireUser(queryClient, request)).resolves.toMatchObject({ id: 'user-1' });
    expect(fetchMock).toHaveBeenCalledTimes(1);
  });
});
