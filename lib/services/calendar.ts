import 'server-only';
// The organisation's working calendar: read by every member (dates of runs, briefs and trends
// depend on it), changed by owners only, always whole and from the version last read.
import type { Transaction } from 'sequelize';
import { WorkCalendar, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { conflict, forbidden } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { workCalendarInputSchema } from '@/lib/validation/calendar';
import { MONDAY_TO_FRIDAY, type WorkCalendar as Calendar } from '@/lib/runs/working-days';
import type { WorkCalendarView } from '@/lib/view-types/calendar';
import { recordAudit } from './audit';

function viewOf(row: WorkCalendar | null): WorkCalendarView {
  if (!row) {
    return { weekdays: [...MONDAY_TO_FRIDAY.weekdays], holidays: [], version: 0, customised: false };
  }
  return {
    weekdays: row.weekdays.split('').map(Number),
    holidays: JSON.parse(row.holidays) as WorkCalendarView['holidays'],
    version: row.version,
    customised: true,
  };
}

async function findRow(organizationId: number, transaction?: Transaction) {
  return WorkCalendar.findOne({
    where: { organizationId },
    transaction,
    lock: transaction ? transaction.LOCK.UPDATE : undefined,
  });
}

export async function getWorkCalendar(actor: Actor): Promise<WorkCalendarView> {
  return viewOf(await findRow(actor.organizationId));
}

/** The calendar the engine's working days become dates with (stored with each run). */
export async function calendarForDates(organizationId: number): Promise<Calendar> {
  const view = viewOf(await findRow(organizationId));
  return { weekdays: view.weekdays, holidays: view.holidays.map((h) => h.date) };
}

/** Replaces the organisation's calendar; 409 with the current one when it changed since it was read. */
export async function setWorkCalendar(actor: Actor, input: unknown): Promise<WorkCalendarView> {
  if (!can(actor.role, 'calendar:manage')) throw forbidden();
  const { weekdays, holidays, version } = parseOrThrow(workCalendarInputSchema, input);
  const sortedDays = [...weekdays].sort((a, b) => a - b).join('');
  const sortedHolidays = [...holidays].sort((a, b) => a.date.localeCompare(b.date));
  return sequelize.transaction(async (transaction) => {
    const row = await findRow(actor.organizationId, transaction);
    const before = viewOf(row);
    if (before.version !== version) {
      throw conflict('Someone changed the calendar since you opened it. Here is the calendar as it is now.', {
        current: before,
      });
    }
    const values = {
      weekdays: sortedDays,
      holidays: JSON.stringify(sortedHolidays),
      version: before.version + 1,
    };
    const saved = row
      ? await row.update(values, { transaction })
      : await WorkCalendar.create({ organizationId: actor.organizationId, ...values }, { transaction });
    const after = viewOf(saved);
    await recordAudit(
      actor,
      {
        entity: 'work-calendar',
        entityId: actor.organizationId,
        action: row ? 'update' : 'create',
        before: { weekdays: before.weekdays, holidays: before.holidays.length },
        after: { weekdays: after.weekdays, holidays: after.holidays.length },
      },
      transaction,
    );
    return after;
  });
}
