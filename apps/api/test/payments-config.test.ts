import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../src/config/env';

describe('payments configuration', () => {
  it('points the SDK at the local fake with local credentials when the fakes run', () => {
    const c = loadConfig({ NODE_ENV: 'development' });
    expect(c.payments).toEqual({
      secretKey: 'sk_test_gloaming_local',
      webhookSecret: 'whsec_gloaming_local',
      api: { host: '127.0.0.1', port: 3026, protocol: 'http' },
    });
    expect(loadConfig({ GLOAMING_PAYMENTS_FAKE_PORT: '0' }).payments.api?.port).toBe(0);
    expect(loadConfig({ GLOAMING_PAYMENTS_FAKE_PORT: '4100' }).payments.api?.port).toBe(4100);
  });

  it('uses the hosted service (api undefined) in production and requires both secrets there', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(ConfigError);
    expect(() => loadConfig({ NODE_ENV: 'production', STRIPE_SECRET_KEY: 'sk_live_x' })).toThrow(/STRIPE_WEBHOOK_SECRET/);
    const c = loadConfig({ NODE_ENV: 'production', STRIPE_SECRET_KEY: 'sk_live_x', STRIPE_WEBHOOK_SECRET: 'whsec_x' });
    expect(c.payments).toEqual({ secretKey: 'sk_live_x', webhookSecret: 'whsec_x' });
  });

  it('honours an explicit host, port and protocol, and refuses a port without a host', () => {
    const c = loadConfig({ GLOAMING_FAKES: 'false', STRIPE_API_HOST: 'payments.internal', STRIPE_API_PORT: '8443' });
    expect(c.payments.api).toEqual({ host: 'payments.internal', port: 8443, protocol: 'https' });
    expect(
      loadConfig({ GLOAMING_FAKES: 'false', STRIPE_API_HOST: '10.0.0.5', STRIPE_API_PROTOCOL: 'http' }).payments.api,
    ).toEqual({
      host: '10.0.0.5',
      port: 80,
      protocol: 'http',
    });
    expect(() => loadConfig({ GLOAMING_FAKES: 'false', STRIPE_API_PORT: '12111' })).toThrow(/STRIPE_API_HOST/);
    expect(() => loadConfig({ STRIPE_API_PROTOCOL: 'ftp' })).toThrow(ConfigError);
    // tests that start their own fake set GLOAMING_FAKES=false: local secrets, hosted api unless told otherwise
    expect(loadConfig({ NODE_ENV: 'test', GLOAMING_FAKES: 'false' }).payments.api).toBeUndefined();
  });
});
