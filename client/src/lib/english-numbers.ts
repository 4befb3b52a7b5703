// Whole numbers with their thousands grouped by commas, as the app writes them everywhere
// ("5,000"), by hand: a page's first Intl.NumberFormat or toLocaleString makes the browser load
// its number data (16-35 ms in Chromium on this project's 2-core machine, more on a slow phone),
// and toLocaleString() without a locale writes the reader's own form ("5.000", "5 000").
// tests/unit/english-dates.test.ts holds it to Intl en-GB's output.
export const grouped = (n: number): string => String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
