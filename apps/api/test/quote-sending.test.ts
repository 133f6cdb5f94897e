import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutboxMessage, PortalToken, Quote, QuoteEvent, QuoteRevision } from '@gloaming/db';
import { startTestServer, type TestServer } from './harness';
import { createGardenQuote, CUSTOMER_NAME, GARDEN_TOTAL_TEXT, gardenEstimate } from './estimate-fixture';
import { canonicalJson } from '@gloaming/db';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => t.close());

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');
const base = (q: { quote: { id: string }; revision: { id: string } }) => `/api/quotes/${q.quote.id}/revisions/${q.revision.id}`;

function linkToken(text: string): string {
  const m = /http:\/\/gloaming\.test\/portal\/q\/([A-Za-z0-9_-]+)/.exec(text);
  if (!m) throw new Error(`no portal link in: ${text}`);
  return m[1]!;
}

describe('sending a quote', () => {
  it('e-mails the PDF and a portal link, freezes the revision and records the event', async () => {
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA, { email: 'send-test@home.example' });
    const agent = await t.signIn('estimator');
    const preview = await agent.get(`${base(g)}/send-preview`).query({ message: 'Lovely to meet you on Tuesday.' });
    expect(preview.status).toBe(200);
    expect(preview.body.to).toBe('send-test@home.example');
    expect(preview.body.blockers).toEqual([]);
    expect(preview.body.text).toContain('Lovely to meet you on Tuesday.');
    expect(preview.body.text).toContain(GARDEN_TOTAL_TEXT);

    const res = await agent.post(`${base(g)}/send`).send({ message: 'Lovely to meet you on Tuesday.' });
    expect(res.status).toBe(201);
    expect(res.body.sentTo).toBe('send-test@home.example');
    expect(res.body.sending.state).toBe('sent');
    expect(res.body.sending.links).toHaveLength(1);

    const mail = await t.catcher.waitFor((m) => m.to.includes('send-test@home.example'));
    expect(mail.subject).toContain('Q-');
    expect(mail.text).toContain(`Dear ${CUSTOMER_NAME}`);
    expect(mail.text).toContain(GARDEN_TOTAL_TEXT);
    expect(mail.attachments).toHaveLength(1);
    expect(mail.attachments[0]).toMatchObject({ contentType: 'application/pdf' });
    expect(mail.attachments[0]!.filename).toMatch(/^Quotation Q-\d{4} rev 1\.pdf$/);
    expect(mail.attachments[0]!.size).toBeGreaterThan(5_000);

    const token = linkToken(mail.text);
    expect(Buffer.from(token, 'base64url')).toHaveLength(32); // 32 random bytes
    const em = t.orm.em.fork();
    const stored = await em.findOneOrFail(PortalToken, { tokenHash: sha256(token) });
    expect(stored.revision.id).toBe(g.revision.id);
    expect(stored.revokedAt).toBeNull();
    expect(await em.count(PortalToken, { tokenHash: token })).toBe(0); // never the token itself

    const revision = await em.findOneOrFail(QuoteRevision, g.revision.id);
    expect(revision.state).toBe('sent');
    expect(revision.sentAt).toBeInstanceOf(Date);
    expect(revision.contentHash).toBe(sha256(canonicalJson(revision.content)));
    const quote = await em.findOneOrFail(Quote, g.quote.id);
    expect(quote.status).toBe('sent');
    // validity: the firm's 30 days (the factory firm's default), and the link expires with it
    expect(quote.validUntil!.getTime() - revision.sentAt!.getTime()).toBe(30 * 24 * 3600_000);
    expect(stored.expiresAt.getTime()).toBe(quote.validUntil!.getTime());
    const events = await em.find(QuoteEvent, { quote: g.quote.id, type: 'sent' });
    expect(events).toHaveLength(1);
    expect(events[0]!.data).toMatchObject({ to: 'send-test@home.example' });

    const again = await agent.post(`${base(g)}/send`).send({});
    expect(again.status).toBe(409);
  });

  it('resends with a new link (the old one stays valid) and revokes them all', async () => {
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA, { email: 'resend@home.example' });
    const agent = await t.signIn('owner');
    expect((await agent.post(`${base(g)}/resend`).send({})).status).toBe(409); // not sent yet
    expect((await agent.post(`${base(g)}/send`).send({})).status).toBe(201);
    const first = linkToken((await t.catcher.waitFor((m) => m.to.includes('resend@home.example'))).text);
    t.catcher.clear();
    const resent = await agent.post(`${base(g)}/resend`).send({ to: 'partner@home.example' });
    expect(resent.status).toBe(201);
    const second = linkToken((await t.catcher.waitFor((m) => m.to.includes('partner@home.example'))).text);
    expect(second).not.toBe(first);
    expect(resent.body.sending.links.filter((l: { active: boolean }) => l.active)).toHaveLength(2);

    const revoked = await agent.post(`${base(g)}/revoke`).send({});
    expect(revoked.status).toBe(200);
    expect(revoked.body.revoked).toBe(2);
    expect(revoked.body.sending.links.every((l: { active: boolean; revokedAt: string | null }) => !l.active && l.revokedAt)).toBe(
      true,
    );
    const em = t.orm.em.fork();
    for (const tok of [first, second])
      expect((await em.findOneOrFail(PortalToken, { tokenHash: sha256(tok) })).revokedAt).toBeInstanceOf(Date);
    const types = (await em.find(QuoteEvent, { quote: g.quote.id }, { orderBy: { at: 'asc' } })).map((e) => e.type);
    expect(types).toEqual(expect.arrayContaining(['sent', 'resent', 'link-revoked']));
    const state = await agent.get(`${base(g)}/sending`);
    expect(state.status).toBe(200);
    expect(state.body.sending.links).toHaveLength(2);
  });

  it('refuses a quote with no lines, or a customer without an e-mail, with 422 and the reason', async () => {
    const empty = await createGardenQuote(t.orm.em.fork(), t.firmA, {
      content: { sections: [{ id: 's', name: 'Whole garden', lines: [] }], discount: null, deposit: null, introduction: '' },
    });
    const agent = await t.signIn('estimator');
    const a = await agent.post(`${base(empty)}/send`).send({});
    expect(a.status).toBe(422);
    expect(a.headers['content-type']).toContain('application/problem+json');
    expect(a.body.errors.map((e: { path: string }) => e.path)).toContain('quote.no-lines');
    const noEmail = await createGardenQuote(t.orm.em.fork(), t.firmA, { email: null });
    const b = await agent.post(`${base(noEmail)}/send`).send({});
    expect(b.status).toBe(422);
    expect(b.body.detail).toContain('has no e-mail address');
    const preview = await agent.get(`${base(noEmail)}/send-preview`);
    expect(preview.body.blockers.map((x: { code: string }) => x.code)).toEqual(['customer-without-email']);
    expect(await t.orm.em.fork().count(PortalToken, { revision: noEmail.revision.id })).toBe(0);
    const content = gardenEstimate();
    content.sections[1]!.lines[1]!.alternativeGroup = 'Tree'; // optional and pick-one at once: the engine refuses it
    const unpriceable = await createGardenQuote(t.orm.em.fork(), t.firmA, { content });
    const c = await agent.post(`${base(unpriceable)}/send`).send({});
    expect(c.status).toBe(422);
    expect(c.body.errors.map((e: { path: string }) => e.path)).toContain('quote.optional-and-alternative');
    const bad = await agent.post(`${base(noEmail)}/send`).send({ to: 'not an address', message: 5 });
    expect(bad.status).toBe(400);
    expect(bad.body.errors.map((e: { path: string }) => e.path).sort()).toEqual(['body.message', 'body.to']);
  });

  it("answers 404 for another firm's revision and 403 for installers", async () => {
    const theirs = await createGardenQuote(t.orm.em.fork(), t.firmB);
    const mine = await createGardenQuote(t.orm.em.fork(), t.firmA);
    const agent = await t.signIn('estimator');
    for (const path of ['send', 'resend', 'revoke']) {
      expect((await agent.post(`${base(theirs)}/${path}`).send({})).status).toBe(404);
      expect((await agent.post(`/api/quotes/${mine.quote.id}/revisions/${theirs.revision.id}/${path}`).send({})).status).toBe(
        404,
      );
    }
    expect((await agent.get(`${base(theirs)}/sending`)).status).toBe(404);
    expect((await agent.get(`${base(theirs)}/send-preview`)).status).toBe(404);
    const installer = await t.signIn('installer');
    expect((await installer.post(`${base(mine)}/send`).send({})).status).toBe(403);
    expect((await installer.post(`${base(mine)}/revoke`).send({})).status).toBe(403);
    expect(await t.orm.em.fork().count(PortalToken, { revision: theirs.revision.id })).toBe(0);
  });
});

describe('when the mail server is down', () => {
  it('records the send, answers 201 "queued" and keeps the e-mail in the outbox', async () => {
    const down = await startTestServer({ SMTP_PORT: '1' }); // nothing listens on port 1
    try {
      const g = await createGardenQuote(down.orm.em.fork(), down.firmA);
      const agent = await down.signIn('estimator');
      const res = await agent.post(`${base(g)}/send`).send({});
      expect(res.status).toBe(201);
      expect(res.body.delivery).toBe('queued');
      expect(res.body.sending.links[0]).toMatchObject({ delivery: 'queued' });
      const em = down.orm.em.fork();
      expect((await em.findOneOrFail(QuoteRevision, g.revision.id)).state).toBe('sent');
      expect(await em.count(QuoteEvent, { quote: g.quote.id, type: 'sent' })).toBe(1);
      const link = await em.findOneOrFail(PortalToken, { revision: g.revision.id });
      const queued = await em.findOneOrFail(OutboxMessage, { reference: link.id });
      expect(queued).toMatchObject({ status: 'pending', to: g.customer.email });
      // the event names the link the e-mail carries
      const sent = await em.findOneOrFail(QuoteEvent, { quote: g.quote.id, type: 'sent' });
      expect(sent.data).toMatchObject({ linkId: link.id });
    } finally {
      await down.close();
    }
  });
});
