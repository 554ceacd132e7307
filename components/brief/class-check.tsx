import type { ClassCheck } from '@/lib/brief/estimate-class';
import { classRangeText, simulatedRangeText } from '@/lib/brief/wording';
import { Notice } from '@/components/ui/notice';

/**
 * The simulated P10–P90 range beside the accuracy range of the project's estimate class
 * (AACE International RP 18R-97), with the warning when the simulated range is narrower.
 * Usable wherever a result is read (the brief, the outcome).
 */
export function ClassCheckPanel({ check }: { check: ClassCheck }) {
  const [simLow, simHigh] = simulatedRangeText(check);
  const [classLow, classHigh] = classRangeText(check);
  return (
    <div className="space-y-2" data-testid="class-check">
      <table className="w-full text-sm">
        <thead>
          <tr className="border-b border-rule text-left text-xs text-ink-soft">
            <th className="py-1 font-medium">Range, as a share of the base estimate</th>
            <th className="num py-1 font-medium">Low</th>
            <th className="num py-1 font-medium">High</th>
          </tr>
        </thead>
        <tbody>
          <tr className="border-b border-rule">
            <td className="py-1">Simulated P10–P90</td>
            <td className="num py-1">{simLow}</td>
            <td className="num py-1">{simHigh}</td>
          </tr>
          <tr className="border-b border-rule">
            <td className="py-1">Class {check.estimateClass} expected accuracy</td>
            <td className="num py-1">{classLow}</td>
            <td className="num py-1">{classHigh}</td>
          </tr>
        </tbody>
      </table>
      <p className="text-xs text-ink-faint">
        Class ranges from AACE International Recommended Practice 18R-97; the practice reads them as roughly
        an 80 % range, hence the comparison with P10–P90. Width ratio {check.widthRatio.toFixed(2)} of the
        class&apos;s narrowest range.
      </p>
      {check.warning ? (
        <Notice tone="caution" title="The simulated range looks narrow">
          {check.warning}
        </Notice>
      ) : null}
    </div>
  );
}
