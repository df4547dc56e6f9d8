/** People and their accounts: sign-up, the account forms and what each role sees. Browser-safe: what other domains, pages and islands may use. */
export * from './form-actions';
export * from './navigation';
export * from './schemas';
export * from './notifications';
