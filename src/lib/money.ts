/** Integer minor units → "€1,234.50" (or "EUR 1,234.50" with `code`, "€1,235" with `whole`) in the record's currency. */
export function formatMoney(minor: number, currency: string, { whole = false, code = false } = {}): string {
  try {
    return new Intl.NumberFormat('en-GB', {
      style: 'currency',
      currency,
      currencyDisplay: code ? 'code' : 'symbol',
      minimumFractionDigits: whole ? 0 : 2,
      maximumFractionDigits: whole ? 0 : 2,
    }).format(minor / 100);
  } catch {
    return `${(minor / 100).toFixed(whole ? 0 : 2)} ${currency}`;
  }
}
