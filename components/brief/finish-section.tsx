import { formatDate, formatDays } from '@/lib/runs/format';
import { calendarText, finishDate } from '@/lib/runs/working-days';
import type { BriefData } from '@/lib/brief/build';
import { finishRows } from '@/lib/brief/finish';
import { SCurveSvg, type CurveMarker } from './s-curve-svg';

/** The finish at P50 and P80 as calendar dates, and the finish S-curve with dates along it. */
export function FinishSection({ brief }: { brief: BriefData }) {
  const finish = brief.finish;
  const duration = brief.duration;
  if (!finish || !duration) return null;
  const dateOf = (days: number) => formatDate(finishDate(finish.baseDate, days, finish.calendar));
  const markers: CurveMarker[] = [
    { label: 'P50', value: finish.p50.days, tone: 'base' },
    { label: finish.atLevel.level, value: finish.atLevel.days, tone: 'level' },
  ];
  if (finish.atLevel.level !== 'P80') markers.push({ label: 'P80', value: finish.p80.days, tone: 'level' });
  if (finish.target) markers.push({ label: 'Target', value: finish.target.days, tone: 'target' });
  return (
    <div className="space-y-2">
      <table className="w-full text-sm break-inside-avoid" data-testid="finish-dates">
        <thead>
          <tr className="border-b border-rule text-xs text-ink-soft">
            <th className="py-1 text-left font-medium">Finish</th>
            <th className="num py-1 font-medium">Date</th>
            <th className="num py-1 font-medium">Working days from {formatDate(finish.baseDate)}</th>
          </tr>
        </thead>
        <tbody>
          {finishRows(finish).map((r) => (
            <tr key={r.key} className="border-b border-rule" data-testid={`finish-${r.key}`}>
              <td className="py-1">{r.label}</td>
              <td className="num py-1 font-medium">{formatDate(r.date)}</td>
              <td className="num py-1 text-ink-soft">{formatDays(r.days, r.wholeDays ? 0 : 1)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <SCurveSvg
        testId="finish-s-curve"
        curve={duration.curve}
        markers={markers}
        tickText={dateOf}
        colour="#6b4fa0"
        label={`Finish S-curve: P80 finish ${formatDate(finish.p80.date)}`}
        caption={
          <>
            Share of simulated outcomes (vertical) finished by each date (horizontal), working days counted
            {calendarText(finish.calendar)} from {formatDate(finish.baseDate)}. 80 % of outcomes finish by{' '}
            {formatDate(finish.p80.date)}.
          </>
        }
      />
    </div>
  );
}
