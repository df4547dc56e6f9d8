/** Deposits paid through the payment provider: the server-only services other domains may call. */
export * from './checkout.server';
export * from './deposit-state.server';
export * from './history.server';
export * from './moves.server';
export * from './provider.server';
export * from './receipt.server';
export * from './reconcile.server';
export * from './refund.server';
export * from './settle.server';
export * from './webhook.server';
export * from './balance.server';
