/*
 * Shares of a whole (variance shares of a budget) as percentages, with the space
 * between number and "%" (SI Brochure, 9th ed., 5.4.7).
 */

/** A share of a whole as a percentage: "0 %", "< 0.1 %", one decimal below 10 %, whole numbers above. */
export function formatPercent(share: number): string {
  const pct = share * 100;
  if (pct === 0) return '0 %';
  if (pct < 0.1) return '< 0.1 %';
  return `${pct.toFixed(pct < 10 ? 1 : 0)} %`;
}
