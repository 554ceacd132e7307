// Proration of a quantity change within a billing period, by the second.
//
//   fraction = (periodEnd − prorationDate) / (periodEnd − periodStart)
//   credit   = −round(unitAmount × oldQuantity × fraction)   (unused time on the old quantity)
//   charge   = +round(unitAmount × newQuantity × fraction)   (remaining time on the new quantity)
//   total    = credit + charge
//
// Amounts are in the currency's minor unit (cents); each line is rounded on its own, as an
// invoice shows whole cents per line.

export type ProrationInput = {
  unitAmount: number;
  oldQuantity: number;
  newQuantity: number;
  periodStart: number;
  periodEnd: number;
  prorationDate: number;
};

export type ProrationLines = { fraction: number; credit: number; charge: number; total: number };

export function prorate(p: ProrationInput): ProrationLines {
  const length = p.periodEnd - p.periodStart;
  const at = Math.min(Math.max(p.prorationDate, p.periodStart), p.periodEnd);
  const fraction = length > 0 ? (p.periodEnd - at) / length : 0;
  const credit = -Math.round(p.unitAmount * p.oldQuantity * fraction);
  const charge = Math.round(p.unitAmount * p.newQuantity * fraction);
  return { fraction, credit, charge, total: credit + charge };
}
