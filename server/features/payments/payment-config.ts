import type Stripe from 'stripe';

/** The payment service's keys, and another host for the SDK (the local fake) when given. */
export interface PaymentConfig {
  secretKey: string;
  webhookSecret: string;
  /** e.g. http://127.0.0.1:43121; the service's own host when not given. */
  apiUrl?: string;
}

/**
 * The SDK's options for a config: `host`, `port` and `protocol` point it at another server
 * (the SDK's documented config; its `ALLOWED_CONFIG_PROPERTIES` in stripe.core.js).
 */
export function sdkOptions(config: PaymentConfig): Stripe.StripeConfig {
  const options: Stripe.StripeConfig = { maxNetworkRetries: 1, timeout: 20_000, telemetry: false };
  if (!config.apiUrl) return options;
  const url = new URL(config.apiUrl);
  const protocol = url.protocol === 'http:' ? 'http' : 'https';
  return {
    ...options,
    host: url.hostname,
    port: Number(url.port) || (protocol === 'http' ? 80 : 443),
    protocol,
  };
}
