/** Run the local fakes on their own: `npm run dev -w @gloaming/fakes`. */
import { startMailCatcher } from './mail-catcher';
import { startPaymentFake } from './payments/payment-fake';

const catcher = await startMailCatcher({
  smtpPort: Number(process.env.SMTP_PORT ?? 1025),
  webPort: Number(process.env.GLOAMING_INBOX_PORT ?? 1080),
});
console.log(`SMTP catcher on ${catcher.host}:${catcher.smtpPort}; inbox at http://${catcher.host}:${catcher.webPort}/`);
const payments = await startPaymentFake({
  port: Number(process.env.GLOAMING_PAYMENTS_FAKE_PORT ?? 3026),
  secretKey: process.env.STRIPE_SECRET_KEY ?? 'sk_test_gloaming_local',
  webhookSecret: process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_gloaming_local',
  ...(process.env.GLOAMING_PAYMENTS_WEBHOOK_URL ? { webhookUrl: process.env.GLOAMING_PAYMENTS_WEBHOOK_URL } : {}),
});
console.log(
  `Payment fake at ${payments.url}/ (REST /v1, test payment page /pay/<session id>); webhooks ${process.env.GLOAMING_PAYMENTS_WEBHOOK_URL ?? 'not sent (set GLOAMING_PAYMENTS_WEBHOOK_URL)'}`,
);
const stop = () => void Promise.all([catcher.close(), payments.close()]).then(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
