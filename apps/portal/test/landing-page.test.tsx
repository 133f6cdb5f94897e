import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { LandingPage } from '../src/landing-page';

afterEach(cleanup);

describe('LandingPage', () => {
  it('explains that the quote arrives as a personal link from the firm', () => {
    render(<LandingPage />);
    const title = screen.getByRole('heading', { level: 1 });
    expect(title.textContent).toBe('Your garden lighting quote arrives as a personal link');
    expect(screen.getByRole('main').textContent).toContain('sends you an e-mail with a link made for you');
  });

  it('lists the four things a homeowner does with the link, in order', () => {
    render(<LandingPage />);
    const steps = within(screen.getByRole('region', { name: 'What you can do with your link' })).getAllByRole('listitem');
    expect(steps.map((step) => within(step).getByRole('heading').textContent)).toEqual([
      'Review your quote',
      'Choose your options',
      'Approve it',
      'Pay the deposit',
    ]);
  });

  it('tells someone who lost the link to contact their firm, and asks for nothing', () => {
    render(<LandingPage />);
    const lost = screen.getByRole('region', { name: 'Lost your link, or it no longer opens?' });
    expect(lost.textContent).toContain('Contact the lighting firm that sent your quote');
    // No sign-in and no look-up on the portal: there is nothing to type.
    expect(screen.queryAllByRole('textbox')).toHaveLength(0);
    expect(document.querySelectorAll('form')).toHaveLength(0);
  });

  it('has a skip link that lands on the main content', () => {
    render(<LandingPage />);
    const skip = screen.getByRole('link', { name: 'Skip to main content' });
    expect(skip.getAttribute('href')).toBe('#main');
    expect(screen.getByRole('main').id).toBe('main');
  });
});
