import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { QuotePhoto } from '@gloaming/contracts';
import { movedOrder, QuotePhotosPanel } from '../../src/features/photos/components/quote-photos-panel';
import { json, problem, stubFetch } from '../fetch-stub';
import { renderWithApp } from '../render';

afterEach(cleanup);

const QUOTE = '7d3f0c6e-52b1-4c1e-9d7a-0a0b0c0d0e0f';
const photo = (id: string, position: number, extra: Partial<QuotePhoto> = {}): QuotePhoto => ({
  id,
  quoteId: QUOTE,
  caption: `Caption ${id}`,
  position,
  onQuote: true,
  contentType: 'image/jpeg',
  width: 1600,
  height: 1200,
  bytes: 200_000,
  createdAt: '2026-12-01T10:00:00.000Z',
  version: 1,
  imageUrl: `/api/quotes/${QUOTE}/photos/${id}/image`,
  thumbnailUrl: `/api/quotes/${QUOTE}/photos/${id}/thumbnail`,
  ...extra,
});

describe('movedOrder', () => {
  it('moves one place and never past either end', () => {
    expect(movedOrder(['a', 'b', 'c'], 'a', 1)).toEqual(['b', 'a', 'c']);
    expect(movedOrder(['a', 'b', 'c'], 'c', -1)).toEqual(['a', 'c', 'b']);
    expect(movedOrder(['a', 'b', 'c'], 'a', -1)).toEqual(['a', 'b', 'c']);
    expect(movedOrder(['a', 'b', 'c'], 'c', 1)).toEqual(['a', 'b', 'c']);
    expect(movedOrder(['a'], 'x', 1)).toEqual(['a']);
  });
});

describe('QuotePhotosPanel', () => {
  it('uploads through the keyboard-reachable button as multipart and shows the new photo', async () => {
    let list = [photo('p1', 0)];
    const { sent, fetchMock } = stubFetch((r) => {
      if (r.method === 'POST') {
        list = [...list, photo('p2', 1, { caption: '' })];
        return json(201, { photo: list[1] });
      }
      return json(200, { photos: list });
    });
    renderWithApp(<QuotePhotosPanel quoteId={QUOTE} />);
    expect(await screen.findByRole('img', { name: 'Caption p1' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Add photos…' })).toBeTruthy();

    const user = userEvent.setup();
    const file = new File([new Uint8Array([0xff, 0xd8, 0xff])], 'front path.jpg', { type: 'image/jpeg' });
    await user.upload(screen.getByLabelText('Choose photos to add'), file);

    await waitFor(() => expect(screen.getByRole('img', { name: 'Photo 2' })).toBeTruthy());
    const post = fetchMock.mock.calls.find(([, init]) => init?.method === 'POST');
    expect(post?.[0]).toBe(`/api/quotes/${QUOTE}/photos`);
    const body = post?.[1]?.body as FormData;
    expect(body).toBeInstanceOf(FormData);
    expect((body.get('file') as File).name).toBe('front path.jpg');
    expect(sent.filter((r) => r.method === 'GET').length).toBeGreaterThanOrEqual(2);
  });

  it("shows the server's reason when a file is refused", async () => {
    stubFetch((r) =>
      r.method === 'POST'
        ? problem(415, {
            title: 'Not a supported image',
            detail: 'Upload a JPEG, PNG or WebP image. The file content is checked, not its name.',
          })
        : json(200, { photos: [] }),
    );
    renderWithApp(<QuotePhotosPanel quoteId={QUOTE} />);
    await screen.findByText('none yet');
    await userEvent
      .setup()
      .upload(screen.getByLabelText('Choose photos to add'), new File(['hello'], 'holiday.jpg', { type: 'image/jpeg' }));
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('holiday.jpg');
    expect(alert.textContent).toContain('The file content is checked, not its name.');
  });

  it('reorders with the buttons and Alt+arrows, and toggles the on-quote choice with the version seen', async () => {
    const list = [photo('p1', 0), photo('p2', 1, { version: 4 }), photo('p3', 2)];
    const { sent } = stubFetch((r) => {
      if (r.method === 'PUT') {
        const ids = (r.body as { photoIds: string[] }).photoIds;
        return json(200, { photos: ids.map((id, i) => ({ ...list.find((p) => p.id === id)!, position: i })) });
      }
      if (r.method === 'PATCH') return json(200, { photo: { ...list[1]!, onQuote: false, version: 5 } });
      return json(200, { photos: list });
    });
    renderWithApp(<QuotePhotosPanel quoteId={QUOTE} />);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Move Caption p1 later' }));
    await waitFor(() => expect(sent.some((r) => r.method === 'PUT')).toBe(true));
    expect(sent.find((r) => r.method === 'PUT')?.body).toEqual({ photoIds: ['p2', 'p1', 'p3'] });

    const items = await screen.findAllByTestId('quote-photo');
    within(items[2]!).getByLabelText('Caption for Caption p3').focus();
    await user.keyboard('{Alt>}{ArrowUp}{/Alt}');
    await waitFor(() => expect(sent.filter((r) => r.method === 'PUT')).toHaveLength(2));
    expect(sent.filter((r) => r.method === 'PUT')[1]?.body).toEqual({ photoIds: ['p2', 'p3', 'p1'] });

    const p2 = screen.getAllByTestId('quote-photo').find((li) => within(li).queryByRole('img', { name: 'Caption p2' }))!;
    await user.click(within(p2).getByRole('checkbox', { name: 'On the quote' }));
    await waitFor(() => expect(sent.some((r) => r.method === 'PATCH')).toBe(true));
    expect(sent.find((r) => r.method === 'PATCH')?.body).toEqual({ onQuote: false, version: 4 });
    vi.restoreAllMocks();
  });
});
