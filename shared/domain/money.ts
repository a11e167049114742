// Money for people: integer cents shown with Intl.NumberFormat in the invoice's currency.
export function formatMoney(cents: number, currency: string, locale = 'en-US'): string {
  return new Intl.NumberFormat(locale, { style: 'currency', currency }).format(cents / 100);
}
