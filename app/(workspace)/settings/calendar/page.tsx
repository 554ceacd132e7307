import { requirePageActor } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { getWorkCalendar } from '@/lib/services/calendar';
import { CalendarEditor } from '@/components/calendar/calendar-editor';

export const metadata = { title: 'Working calendar' };

export default async function CalendarPage() {
  const actor = await requirePageActor('project:read', '/settings/calendar');
  const calendar = await getWorkCalendar(actor);
  const canEdit = can(actor.role, 'calendar:manage');
  return (
    <div className="max-w-4xl space-y-4">
      <h1 className="text-2xl font-semibold">Working calendar</h1>
      <p className="text-sm text-ink-soft">
        Simulated durations are counted in working days. This calendar turns them into dates: finish P-dates,
        the finish S-curve, briefs and the trend. Runs started from now on use it; a run already made keeps
        the calendar it was started with, so its dates do not move.
        {canEdit ? null : ' Only an owner can change it.'}
      </p>
      <CalendarEditor initial={calendar} canEdit={canEdit} />
    </div>
  );
}
