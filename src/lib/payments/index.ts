/** Deposits paid through the payment provider. Browser-safe: what other domains, pages and islands may use. */
export * from './refund-request';
export * from './transitions';
