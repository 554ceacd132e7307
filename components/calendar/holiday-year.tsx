import type { WorkCalendarView } from '@/lib/view-types/calendar';
import { Button } from '@/components/ui/button';
import { Select } from '@/components/ui/field';
import { formatDate } from '@/lib/runs/format';

const DAY_NAMES = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'];
const weekdayName = (iso: string) => DAY_NAMES[new Date(`${iso}T00:00:00Z`).getUTCDay()];

/** One year's holidays as a table, with a choice of year. */
export function HolidayYear({
  year,
  years,
  onYear,
  holidays,
  canEdit,
  onRemove,
}: {
  year: number;
  years: number[];
  onYear: (year: number) => void;
  holidays: WorkCalendarView['holidays'];
  canEdit: boolean;
  onRemove: (date: string) => void;
}) {
  return (
    <div className="space-y-2">
      <label className="flex items-center gap-2 text-sm text-ink-soft">
        Year
        <span className="w-28">
          <Select value={year} onChange={(e) => onYear(Number(e.target.value))}>
            {years.map((y) => (
              <option key={y} value={y}>
                {y}
              </option>
            ))}
          </Select>
        </span>
        <span>
          {holidays.length} holiday{holidays.length === 1 ? '' : 's'} in {year}
        </span>
      </label>
      {holidays.length === 0 ? (
        <p className="text-sm text-ink-faint">
          No holidays in {year} yet. Add one below or import a CSV file.
        </p>
      ) : (
        <table className="w-full max-w-2xl text-sm" data-testid="holiday-table">
          <thead>
            <tr className="text-left text-xs uppercase tracking-wide text-ink-faint">
              <th className="py-1 font-medium">Date</th>
              <th className="py-1 font-medium">Day</th>
              <th className="py-1 font-medium">Name</th>
              {canEdit ? <th className="py-1" /> : null}
            </tr>
          </thead>
          <tbody>
            {holidays.map((h) => (
              <tr key={h.date} className="border-t border-rule">
                <td className="num py-1">{formatDate(h.date)}</td>
                <td className="py-1 text-ink-soft">{weekdayName(h.date)}</td>
                <td className="py-1">{h.name || <span className="text-ink-faint">—</span>}</td>
                {canEdit ? (
                  <td className="py-1 text-right">
                    <Button
                      variant="ghost"
                      onClick={() => onRemove(h.date)}
                      aria-label={`Remove ${formatDate(h.date)}`}
                    >
                      Remove
                    </Button>
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
