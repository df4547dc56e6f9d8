const KNOWN_CURRENCIES = new Set(Intl.supportedValuesOf('currency').map((code) => code.toLowerCase()));

export function isKnownCurrency(code: string): boolean {
  return KNOWN_CURRENCIES.has(code);
}

/** Formats an amount in minor units (pence, cents, yen) for people, e.g. 123450 gbp → £1,234.50. */
export function formatMinorUnits(amount: number, currency: string, locale = 'en-GB'): string {
  const format = new Intl.NumberFormat(locale, { style: 'currency', currency: currency.toUpperCase() });
  const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
  return format.format(amount / 10 ** digits);
}
