/** The face of the quote computations: import from here, not from the files beside it. */
export {
  computeQuoteTotals,
  QUOTE_LINE_KINDS,
  QUOTE_LINE_KIND_LABELS,
  TAXABLE_KINDS,
  type LineTotal,
  type QuoteLine,
  type QuoteLineKind,
  type QuoteTotals,
  type TaxableKind,
  type TaxRounding,
  type TotalsOptions,
} from "./totals";
export {
  centsToInput,
  divRoundHalfUp,
  formatAmount,
  formatCents,
  formatPercent,
  hasAtMostDecimals,
  mulDivRoundHalfUp,
  parseMoneyToCents,
  percentOfCents,
  toUnits,
} from "./money";
export { describeFinish, type FinishLayerWords } from "./finish-words";
export { customerLineDetail, taxLabel } from "./line-words";
