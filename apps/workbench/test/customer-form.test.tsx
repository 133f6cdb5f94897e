import { QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter, Route, Routes } from 'react-router-dom';
import { afterEach, describe, expect, it } from 'vitest';
import { NewCustomerPage } from '../src/features/customers/components/new-customer-page';
import { sessionKeys } from '../src/features/session/api/session-keys';
import { createQueryClient } from '../src/lib/query-client';
import { json, OWNER, problem, stubFetch } from './fetch-stub';
import { descriptionOf } from './render';

afterEach(cleanup);

function renderPage() {
  const queryClient = createQueryClient();
  queryClient.setQueryData(sessionKeys.current(), OWNER);
  render(
    <QueryClientProvider client={queryClient}>
      <MemoryRouter initialEntries={['/customers/new']}>
        <Routes>
          <Route path="/customers/new" element={<NewCustomerPage />} />
          <Route path="/customers/:id" element={<p>customer page</p>} />
        </Routes>
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

describe('NewCustomerPage', () => {
  it('checks the fields against the contract before sending anything', async () => {
    const { fetchMock } = stubFetch(() => json(500, {}));
    renderPage();
    await userEvent.setup().click(screen.getByRole('button', { name: 'Save customer' }));
    // messages defined in @gloaming/contracts (CustomerInput, SiteInput)
    const name = screen.getByLabelText('Name');
    await waitFor(() => expect(name.getAttribute('aria-invalid')).toBe('true'));
    expect(descriptionOf(name)).toBe('Enter the customer’s name.');
    expect(descriptionOf(screen.getByLabelText('Address'))).toBe('Enter the address of the site.');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('puts the api’s field errors on their fields, nested site fields included', async () => {
    const { sent } = stubFetch(() =>
      problem(400, {
        title: 'Some fields need attention',
        detail: 'Some fields need attention.',
        errors: [
          { path: 'body.email', message: 'That address bounced last time.' },
          { path: 'body.sites.0.postcode', message: 'Postcode is at most 16 characters.' },
        ],
      }),
    );
    renderPage();
    const user = userEvent.setup();
    await user.type(screen.getByLabelText('Name'), 'Wilhelmina Oakes');
    await user.type(screen.getByLabelText('E-mail'), 'wil@oakes.example');
    await user.type(screen.getByLabelText('Address'), '3 Rookery Close');
    await user.click(screen.getByRole('button', { name: 'Save customer' }));

    const email = screen.getByLabelText('E-mail');
    await waitFor(() => expect(email.getAttribute('aria-invalid')).toBe('true'));
    expect(descriptionOf(email)).toBe('That address bounced last time.');
    expect(descriptionOf(screen.getByLabelText('Postcode'))).toBe('Postcode is at most 16 characters.');
    expect(sent[0]).toMatchObject({ method: 'POST', url: '/api/customers', body: { name: 'Wilhelmina Oakes', email: 'wil@oakes.example', sites: [{ addressLines: '3 Rookery Close' }] } });
    // every error found its field, so no form-level alert
    expect(screen.queryByText('Some fields need attention.')).toBeNull();
  });
});
