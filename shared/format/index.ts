/** How Halflight writes numbers, units and dates for people: screens, CSV headers, PNG and PDF. */
export {
  formatFixed,
  formatNumber,
  formatQuantity,
  MINUS,
  powerOfTen,
  superscript,
  TIMES,
  withTrueMinus,
} from './format-number';
export { estimateParts, formatEstimate, formatInterval, uncertaintyDigit, type EstimateParts } from './format-estimate';
export { titled, UNITS, type UnitText } from './quantity-units';
export { SYMBOLS, symbolPlain, symbolText, type SubscriptedSymbol } from './quantity-symbols';
export { formatDate, formatDateTime, isoDate, isoDateTime } from './format-date';
export {
  fitParameterLines,
  replicateRunsText,
  rSquaredLines,
  tau0Text,
  weightingComparisonText,
  weightingText,
  type ParameterLine,
} from './fit-parameters';
export { describeUploadReading } from './upload-reading';
