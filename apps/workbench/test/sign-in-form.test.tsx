import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { sessionKeys } from '../src/features/session/api/session-keys';
import { SignInForm } from '../src/features/session/components/sign-in-form';
import { json, OWNER, problem, stubFetch } from './fetch-stub';
import { descriptionOf, renderWithApp } from './render';

afterEach(cleanup);

async function submit(email: string, password: string) {
  const user = userEvent.setup();
  if (email) await user.type(screen.getByLabelText('E-mail'), email);
  if (password) await user.type(screen.getByLabelText('Password'), password);
  await user.click(screen.getByRole('button', { name: 'Sign in' }));
}

describe('SignInForm', () => {
  it('checks the fields against the contract before sending anything', async () => {
    const { fetchMock } = stubFetch(() => json(200, { user: OWNER }));
    renderWithApp(<SignInForm onSignedIn={vi.fn()} />);

    await submit('maren at alder-row', '');

    const email = screen.getByLabelText('E-mail');
    const password = screen.getByLabelText('Password');
    // Messages defined in @gloaming/contracts (Email and SignInRequest).
    expect(email.getAttribute('aria-invalid')).toBe('true');
    expect(descriptionOf(email)).toBe('Enter an e-mail address like name@example.com.');
    expect(password.getAttribute('aria-invalid')).toBe('true');
    expect(descriptionOf(password)).toBe('Enter your password.');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('shows the field errors the api returns beside their fields', async () => {
    stubFetch(() =>
      problem(400, {
        title: 'Invalid request',
        detail: 'Check the highlighted fields.',
        errors: [{ path: 'body.password', message: 'Use at most 200 characters.' }],
      }),
    );
    renderWithApp(<SignInForm onSignedIn={vi.fn()} />);

    await submit('maren@alder-row.test', 'something');

    const password = await screen.findByLabelText('Password');
    await waitFor(() => expect(password.getAttribute('aria-invalid')).toBe('true'));
    expect(descriptionOf(password)).toBe('Use at most 200 characters.');
    expect(screen.getByLabelText('E-mail').getAttribute('aria-invalid')).toBeNull();
    // Every error sits on a field, so the form-level region stays empty.
    expect(screen.getByTestId('sign-in-message').textContent).toBe('');
  });

  it('announces the 401 detail in the alert region and does not sign in', async () => {
    const detail = 'That e-mail address and password do not match an account. Check both and try again.';
    stubFetch(() => problem(401, { title: 'Sign-in failed', detail }));
    const onSignedIn = vi.fn();
    renderWithApp(<SignInForm onSignedIn={onSignedIn} />);

    await submit('maren@alder-row.test', 'not the password');

    const alert = await screen.findByRole('alert');
    await waitFor(() => expect(alert.textContent).toContain(detail));
    expect(alert.textContent).toContain('Could not sign you in');
    expect(onSignedIn).not.toHaveBeenCalled();
    expect(screen.getByLabelText('Password').getAttribute('aria-invalid')).toBeNull();
  });

  it('announces the throttle message when sign-in is paused', async () => {
    const detail = 'Too many sign-in attempts for this account. Try again in 15 minutes.';
    stubFetch(() => problem(429, { title: 'Too many requests', detail, retryAfterSeconds: 900 }));
    renderWithApp(<SignInForm onSignedIn={vi.fn()} />);

    await submit('maren@alder-row.test', 'guess number six');

    const alert = await screen.findByRole('alert');
    await waitFor(() => expect(alert.textContent).toContain(detail));
  });

  it('sends the normalised e-mail, caches the user and reports success', async () => {
    const { sent } = stubFetch(() => json(200, { user: OWNER }));
    const onSignedIn = vi.fn();
    const { queryClient } = renderWithApp(<SignInForm onSignedIn={onSignedIn} />);

    await submit('  Maren@Alder-Row.test ', 'correct horse battery');

    await waitFor(() => expect(onSignedIn).toHaveBeenCalledTimes(1));
    expect(onSignedIn.mock.calls[0]?.[0]).toMatchObject({ name: 'Maren Holloway', role: 'owner' });
    // The contract's Email trims and lower-cases before the request leaves the browser.
    expect(sent[0]?.body).toEqual({ email: 'maren@alder-row.test', password: 'correct horse battery' });
    expect(queryClient.getQueryData(sessionKeys.current())).toMatchObject({ id: 'user-1' });
  });
});
