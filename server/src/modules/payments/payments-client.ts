// The payment SDK client for the configured payments service (the local stand-in in the
// demo and tests: plain http on 127.0.0.1).
import Stripe from 'stripe';
import type { Config } from '../../config/env.js';

const clients = new Map<string, Stripe>();

export function paymentsClient(config: Config): Stripe {
  const key = `${config.payments.apiUrl}|${config.payments.secretKey}`;
  let client = clients.get(key);
  if (!client) {
    const url = new URL(config.payments.apiUrl);
    client = new Stripe(config.payments.secretKey, {
      host: url.hostname,
      port: url.port || (url.protocol === 'https:' ? 443 : 80),
      protocol: url.protocol === 'https:' ? 'https' : 'http',
      maxNetworkRetries: config.env === 'test' ? 0 : 2,
      timeout: 10_000,
      telemetry: false,
    });
    clients.set(key, client);
  }
  return client;
}
