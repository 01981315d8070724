/**
 * Money as every page and message shows it: integer minor units in the record's currency → "€1,234.50", or "€1,235"
 * with `whole`. The one place that formats money, so a cost never reads "EUR 1,300.00" in one place and "€" in another.
 */
export function formatMoney(minor: number, currency: string, { whole = false } = {}): string {
  try {
    return new Intl.NumberFormat('en-GB', {
      style: 'currency',
      currency,
      minimumFractionDigits: whole ? 0 : 2,
      maximumFractionDigits: whole ? 0 : 2,
    }).format(minor / 100);
  } catch {
    // a code Intl does not know is still written, after the figure
    return `${(minor / 100).toFixed(whole ? 0 : 2)} ${currency}`;
  }
}
