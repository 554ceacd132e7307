// The one place for figures: every screen, the brief's PDF and the mails write numbers, money,
// percentages, dates and intervals through these functions, so each reads the same everywhere.
export { LOCALE, MINUS, signed } from './locale';
export {
  formatChange,
  formatCount,
  formatDays,
  formatMoney,
  formatMoneyExact,
  formatMoneyShort,
  formatNumber,
  formatPercent,
  formatSignedPercent,
} from './numbers';
export { formatDate, formatDateTime } from './dates';
export { formatInterval } from './intervals';
export { distText, fieldWords, valueText, type ValueKind } from './values';
