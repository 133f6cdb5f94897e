/**
 * Firm settings: the owner reads and saves them whole (validation failures are problem+json
 * with field paths); new quotes take the new values; revisions already sent keep theirs.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { FirmSettingsResponse, QuoteDetailResponse, type FirmSettings } from '@gloaming/contracts';
import { QuoteRevision } from '@gloaming/db';
import { startTestServer, type TestServer } from './harness';
import { createQuoteFixture } from './quote-fixtures';
import { markRevisionSent, currentRevision, loadQuoteForFirm } from '../src/modules/quotes/service';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => t.close());

async function read(agent: Awaited<ReturnType<TestServer['signIn']>>) {
  return FirmSettingsResponse.parse((await agent.get('/api/organization/settings').expect(200)).body);
}

describe('firm settings', () => {
  it('only the owner reads and saves them', async () => {
    for (const role of ['estimator', 'installer'] as const) {
      const agent = await t.signIn(role);
      await agent.get('/api/organization/settings').expect(403);
      await agent.put('/api/organization/settings').send({}).expect(403);
    }
  });

  it('reports every bad field with its path, and writes nothing', async () => {
    const owner = await t.signIn('owner');
    const { settings, version } = await read(owner);
    const bad = {
      ...settings,
      name: '',
      depositPercentBp: 12_000,
      quoteValidityDays: 0,
      emailSenderName: 'Evil <x@y>',
      design: {
        ...settings.design,
        cableSlackBp: -1,
        labourMinutes: { ...settings.design.labourMinutes, minutesPerDriver: 1.23456 },
        ipMinimums: { submerged: 'IP99' },
        codeProfile: 'mars',
      },
    };
    const res = await owner.put('/api/organization/settings').send({ version, settings: bad }).expect(400);
    expect(res.headers['content-type']).toContain('application/problem+json');
    const paths = res.body.errors.map((e: { path: string }) => e.path).sort();
    expect(paths).toEqual(
      [
        'body.settings.name',
        'body.settings.depositPercentBp',
        'body.settings.design.labourMinutes.minutesPerDriver',
        'body.settings.design.cableSlackBp',
        'body.settings.design.ipMinimums.submerged',
        'body.settings.design.codeProfile',
        'body.settings.quoteValidityDays',
        'body.settings.emailSenderName',
      ].sort(),
    );
    // the cross-field rule (checked once every field is valid): the list of rates holds the standard one
    const rates = await owner.put('/api/organization/settings').send({ version, settings: { ...settings, vatRateBp: 2000, vatRatesBp: [500, 0] } }).expect(400);
    expect(rates.body.errors).toEqual([{ path: 'body.settings.vatRatesBp', message: 'The list of VAT rates must include the standard rate.' }]);
    expect((await read(owner)).version).toBe(version);
  });

  it('a stale version is a 409', async () => {
    const owner = await t.signIn('owner');
    const { settings, version } = await read(owner);
    await owner.put('/api/organization/settings').send({ version: version + 5, settings: { ...settings, termsText: 'x' } }).expect(409);
  });

  it('changes apply to new quotes; a sent revision keeps the values it was priced with', async () => {
    const owner = await t.signIn('owner');
    const em = t.orm.em.fork();
    // a quote sent under the old settings (20 % VAT, 35 % markup, 30 days, 20 min per fitting)
    const { quote } = await createQuoteFixture(em, t.firmA, 'Before Change');
    const q = await loadQuoteForFirm(em, t.firmA.firm.id, quote.id);
    await markRevisionSent(em, q, await currentRevision(em, q), { id: t.firmA.users.owner.id });
    await em.flush();

    const { settings, version } = await read(owner);
    const next: FirmSettings = {
      ...settings,
      markupPercentBp: 5000,
      depositPercentBp: 2500,
      quoteValidityDays: 14,
      termsText: 'Balance due on completion.',
      design: { ...settings.design, cableSlackBp: 1500, labourMinutes: { ...settings.design.labourMinutes, minutesPerFitting: 25 } },
    };
    const saved = FirmSettingsResponse.parse((await owner.put('/api/organization/settings').send({ version, settings: next }).expect(200)).body);
    expect(saved.settings.markupPercentBp).toBe(5000);
    expect(saved.version).toBeGreaterThan(version);

    const sent = await t.orm.em.fork().findOneOrFail(QuoteRevision, { quote: quote.id, number: 1 });
    expect(sent.state).toBe('sent');
    expect(sent.settings).toMatchObject({ markupPercentBp: 3500, depositPercentBp: 3000, quoteValidityDays: 30, termsText: '' });
    expect((sent.settings as { design: { cableSlackBp: number; labourMinutes: { minutesPerFitting: number } } }).design).toMatchObject({
      cableSlackBp: 1000,
      labourMinutes: { minutesPerFitting: 20 },
    });

    const created = QuoteDetailResponse.parse(
      (await owner.post('/api/quotes').send({ customerId: quote.customer.id }).expect(201)).body,
    );
    expect(created.revision.settings).toMatchObject({ markupPercentBp: 5000, depositPercentBp: 2500, quoteValidityDays: 14, termsText: 'Balance due on completion.' });
    expect(created.revision.settings.design).toMatchObject({ cableSlackBp: 1500, labourMinutes: { minutesPerFitting: 25 } });
    // a revision of the sent quote is new: it takes the new settings; the sent one is untouched
    const revised = QuoteDetailResponse.parse((await owner.post(`/api/quotes/${quote.id}/revisions`).send({}).expect(201)).body);
    expect(revised.revision.number).toBe(2);
    const stillSent = await t.orm.em.fork().findOneOrFail(QuoteRevision, { quote: quote.id, number: 1 });
    expect(stillSent.settings).toMatchObject({ markupPercentBp: 3500 });
  });

  it('uploads a logo (type from the bytes, stored as PNG), serves it, and refuses a non-image', async () => {
    const owner = await t.signIn('owner');
    const jpeg = await sharp({ create: { width: 1200, height: 400, channels: 3, background: '#224466' } }).jpeg().toBuffer();
    const up = await owner.put('/api/organization/logo').attach('file', jpeg, { filename: 'logo.png', contentType: 'image/png' }).expect(200);
    expect(FirmSettingsResponse.parse(up.body).logo).not.toBeNull();
    const got = await owner.get('/api/organization/logo').buffer(true).expect(200);
    expect(got.headers['content-type']).toBe('image/png');
    const meta = await sharp(got.body as Buffer).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(['png', 800, 267]); // 1200x400 fitted inside 800: 800 x 266.67 -> 267
    const text = await owner.put('/api/organization/logo').attach('file', Buffer.from('not an image at all'), 'logo.png').expect(415);
    expect(text.headers['content-type']).toContain('application/problem+json');
    const none = await owner.put('/api/organization/logo').expect(400);
    expect(none.body.errors[0].path).toBe('body.file');
    await owner.delete('/api/organization/logo').expect(200);
    await owner.get('/api/organization/logo').expect(404);
  });
});
