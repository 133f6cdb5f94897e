import express, { type Response, type Router } from 'express';
import {
  DepositPaymentParams,
  PortalDepositQuery,
  PortalTokenParams,
  QuoteDepositsParams,
  RefundDepositRequest,
} from '@gloaming/contracts';
import type { EntityManager } from '@gloaming/db';
import type { ModuleDeps } from '../../app-deps';
import { HttpError } from '../../http/problem';
import { allowRoles, moduleRouter, publicRoute, route, type RegisteredRoute } from '../../http/routes';
import { markLinkFailure, portalLinkThrottle, resolvePortalAccess } from '../portal/portal-access';
import { loadQuoteForFirm } from '../quotes/service';
import { createPaymentClient, WEBHOOK_TOLERANCE_SECONDS, type PaymentClient } from './payment-client';
import { presentDepositPayment } from './presenter';
import { portalDepositState, quoteDeposits, refundDeposit, startCheckout, type DepositDeps } from './service';
import { processPaymentEvent } from './webhook';

/** Where the provider delivers events. Public, authenticated by its signature, not by a session. */
export const PAYMENT_WEBHOOK_PATH = '/api/payments/webhook';

/**
 * The webhook needs the exact bytes the provider signed, so its body is read raw (mounted in
 * app.ts before the JSON parser). 256 kB is well above any event we handle.
 */
export const paymentWebhookBodyParser = express.raw({ type: () => true, limit: '256kb' });

const badSignature = (detail: string) => new HttpError(400, 'invalid-signature', 'Webhook signature not accepted', detail);

/** Portal deposit routes, the provider's webhook and the staff routes, sharing one SDK client. */
export function depositsRouters(deps: ModuleDeps, registry: RegisteredRoute[], stripe: PaymentClient = createPaymentClient(deps.config.payments)): Router[] {
  const ctx: DepositDeps = { deps, stripe };
  // links that do not work count towards the portal's per-IP limit, as on the portal's own routes
  const linkThrottle = portalLinkThrottle(deps.config.portalThrottle, deps.rateLimits('portal-link'));
  const access = async (res: Response, em: EntityManager, token: string) => {
    try {
      return await resolvePortalAccess(em, token);
    } catch (err) {
      markLinkFailure(res, err);
      throw err;
    }
  };

  const portal = moduleRouter('/api/portal', registry, [
    route({
      method: 'get',
      path: '/:token/deposit',
      summary: 'The deposit of an approved quote and the state of its payment (the return page polls this)',
      policy: publicRoute,
      before: [linkThrottle],
      schemas: { params: PortalTokenParams, query: PortalDepositQuery },
      handler: async ({ res, em, input }) => {
        const opened = await access(res, em, input.params.token);
        res.json({ deposit: await portalDepositState(em, opened, input.query.session) });
      },
    }),
    route({
      method: 'post',
      path: '/:token/deposit/checkout',
      summary: 'Start (or resume) the card checkout for the approved deposit',
      policy: publicRoute,
      before: [linkThrottle],
      schemas: { params: PortalTokenParams },
      handler: async ({ res, em, input }) => {
        const opened = await access(res, em, input.params.token);
        res.status(201).json(await startCheckout(ctx, em, opened, input.params.token));
      },
    }),
  ]);

  const webhook = moduleRouter('/api/payments', registry, [
    route({
      method: 'post',
      path: '/webhook',
      summary: "The payment provider's signed events (server to server; verified by signature)",
      policy: publicRoute,
      handler: async ({ req, res, em }) => {
        const raw: unknown = req.body;
        if (!Buffer.isBuffer(raw)) throw badSignature('The event body could not be read.');
        const header = req.headers['stripe-signature'];
        if (typeof header !== 'string' || header.length === 0) throw badSignature('The event carries no signature.');
        let event;
        try {
          event = stripe.webhooks.constructEvent(raw, header, deps.config.payments.webhookSecret, WEBHOOK_TOLERANCE_SECONDS);
        } catch (err) {
          throw badSignature(err instanceof Error ? err.message : 'The signature does not match.');
        }
        const outcome = await processPaymentEvent(ctx, em, event);
        // every verified event is acknowledged with 2xx, also one that names nothing of ours:
        // the provider retries non-2xx answers, and a retry of an event we cannot place
        // would never succeed
        res.status(200).json({ received: true, outcome: outcome.kind });
      },
    }),
  ]);

  const staffRoles = allowRoles('owner', 'estimator');
  const staff = moduleRouter('/api/quotes', registry, [
    route({
      method: 'get',
      path: '/:id/deposits',
      summary: "A quote's approved deposit and its payments",
      policy: staffRoles,
      schemas: { params: QuoteDepositsParams },
      handler: async ({ res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        res.json(await quoteDeposits(em, quote));
      },
    }),
    route({
      method: 'post',
      path: '/:id/deposits/:paymentId/refund',
      summary: 'Refund a paid deposit, in full or in part, through the payment provider',
      policy: allowRoles('owner'),
      schemas: { params: DepositPaymentParams, body: RefundDepositRequest },
      handler: async ({ res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        const result = await refundDeposit(ctx, em, quote, input.params.paymentId, input.body.amountMinor, { id: auth.user.id });
        res.status(201).json({ payment: presentDepositPayment(result.payment), refundedNowMinor: result.refundedNowMinor });
      },
    }),
  ]);

  return [portal, webhook, staff];
}
