import { CLASS_CHECK_SOURCE, type ClassCheck } from '@/lib/domain/estimate-class';
import { formatMoney } from '@/lib/runs/format';
import { classBandsText, classCheckWarnings, simulatedRangeText, VERDICT_TEXT } from '@/lib/brief/wording';
import { Notice } from '@/components/ui/notice';

const VERDICT_TONE = {
  narrow: 'text-caution-dark font-semibold',
  within: 'text-ink-soft',
  wide: 'text-caution-dark font-semibold',
};

/**
 * The simulated P10–P90 range, measured around the P50 (the estimate with its contingency), beside
 * the narrowest and widest accuracy range of the project's estimate class, side by side, with a
 * verdict for each side. Usable wherever a result is read (the brief, the outcome).
 */
export function ClassCheckPanel({ check, currency }: { check: ClassCheck; currency: string }) {
  const [simLow, simHigh] = simulatedRangeText(check);
  const { narrowest, widest } = classBandsText(check);
  const warnings = classCheckWarnings(check);
  const row = (label: string, [low, high]: [string, string], strong = false) => (
    <tr className="border-b border-rule">
      <td className={`py-1 ${strong ? 'font-medium' : ''}`}>{label}</td>
      <td className="num py-1">{low}</td>
      <td className="num py-1">{high}</td>
    </tr>
  );
  return (
    <div className="space-y-2" data-testid="class-check">
      <table className="w-full text-sm">
        <thead>
          <tr className="border-b border-rule text-left text-xs text-ink-soft">
            <th className="py-1 font-medium">
              Range as a share of the P50 of cost ({formatMoney(check.reference, currency)})
            </th>
            <th className="num py-1 font-medium">Low side</th>
            <th className="num py-1 font-medium">High side</th>
          </tr>
        </thead>
        <tbody>
          {row('Simulated P10 and P90', [simLow, simHigh], true)}
          {row(`Class ${check.estimateClass}, narrowest expected`, narrowest)}
          {row(`Class ${check.estimateClass}, widest expected`, widest)}
          <tr className="border-b border-rule" data-testid="class-verdict">
            <td className="py-1">Verdict</td>
            <td className={`num py-1 ${VERDICT_TONE[check.low]}`}>{VERDICT_TEXT[check.low]}</td>
            <td className={`num py-1 ${VERDICT_TONE[check.high]}`}>{VERDICT_TEXT[check.high]}</td>
          </tr>
        </tbody>
      </table>
      <p className="text-xs text-ink-faint">
        Measured around the estimate including contingency at about P50, not around the base, on each side.
        Source: {CLASS_CHECK_SOURCE}; check them against the current revision. Reading the class ranges as a
        P10–P90 range is common practice.
      </p>
      {warnings.length ? (
        <Notice tone="caution" title="The simulated range is out of the class's band">
          {warnings.map((w) => (
            <p key={w}>{w}</p>
          ))}
        </Notice>
      ) : null}
    </div>
  );
}
