'use client';

import { useEffect, useMemo, useState } from 'react';
import type { WorkCalendarView } from '@/lib/view-types/calendar';
import { ApiError, callApi, failureMessage } from '@/components/forms/api';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { TextInput } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { formatDate } from '@/lib/runs/format';
import { isIsoDate, parseHolidayCsv } from '@/lib/runs/holiday-csv';
import { calendarText } from '@/lib/runs/working-days';
import { HolidayYear } from './holiday-year';

const WEEKDAYS = [
  [1, 'Mon'],
  [2, 'Tue'],
  [3, 'Wed'],
  [4, 'Thu'],
  [5, 'Fri'],
  [6, 'Sat'],
  [7, 'Sun'],
] as const;

type Holiday = WorkCalendarView['holidays'][number];
type Status = { tone: 'success' | 'invalid' | 'caution'; text: string; lines?: string[] } | null;

const byDate = (a: Holiday, b: Holiday) => a.date.localeCompare(b.date);
const sameCalendar = (a: { weekdays: number[]; holidays: Holiday[] }, b: typeof a) =>
  JSON.stringify([a.weekdays, a.holidays]) === JSON.stringify([b.weekdays, b.holidays]);

/** The organisation's working week and holidays, edited as a draft and saved whole. */
export function CalendarEditor({ initial, canEdit }: { initial: WorkCalendarView; canEdit: boolean }) {
  const [saved, setSaved] = useState(initial);
  const [weekdays, setWeekdays] = useState(initial.weekdays);
  const [holidays, setHolidays] = useState(initial.holidays);
  const [year, setYear] = useState(() => new Date().getUTCFullYear());
  const [newDate, setNewDate] = useState('');
  const [newName, setNewName] = useState('');
  const [status, setStatus] = useState<Status>(null);
  const [saving, setSaving] = useState(false);
  const dirty = !sameCalendar({ weekdays, holidays }, saved);

  // Changes not saved are lost on leaving: say so before the page goes.
  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  const years = useMemo(() => {
    const set = new Set(holidays.map((h) => Number(h.date.slice(0, 4))));
    set.add(year);
    return [...set].sort((a, b) => a - b);
  }, [holidays, year]);

  const toggleDay = (day: number) =>
    setWeekdays((days) =>
      days.includes(day) ? days.filter((d) => d !== day) : [...days, day].sort((a, b) => a - b),
    );

  const addOne = () => {
    if (!isIsoDate(newDate)) return setStatus({ tone: 'invalid', text: 'Choose the holiday’s date first.' });
    if (holidays.some((h) => h.date === newDate)) {
      return setStatus({ tone: 'invalid', text: `${formatDate(newDate)} is already a holiday.` });
    }
    setHolidays((list) => [...list, { date: newDate, name: newName.trim() }].sort(byDate));
    setYear(Number(newDate.slice(0, 4)));
    setNewDate('');
    setNewName('');
    setStatus(null);
  };

  const importFile = async (file: File) => {
    const { holidays: read, errors } = parseHolidayCsv(await file.text());
    const known = new Set(holidays.map((h) => h.date));
    const fresh = read.filter((h) => !known.has(h.date));
    setHolidays((list) => [...list, ...fresh].sort(byDate));
    if (fresh.length) setYear(Number(fresh[0].date.slice(0, 4)));
    const already = read.length - fresh.length;
    setStatus({
      tone: errors.length ? 'caution' : 'success',
      text:
        `Read ${read.length} date${read.length === 1 ? '' : 's'} from ${file.name}: ${fresh.length} added` +
        `${already ? `, ${already} already listed` : ''}. Save to keep them.`,
      lines: errors.map((e) => `Line ${e.line}: ${e.message}`),
    });
  };

  const save = async () => {
    setSaving(true);
    setStatus(null);
    try {
      const reply = await callApi<{ calendar: WorkCalendarView }>('/api/calendar', {
        method: 'PUT',
        body: { weekdays, holidays, version: saved.version },
      });
      setSaved(reply.calendar);
      setWeekdays(reply.calendar.weekdays);
      setHolidays(reply.calendar.holidays);
      setStatus({
        tone: 'success',
        text: `Saved: ${calendarText({ weekdays, holidays: holidays.map((h) => h.date) })}.`,
      });
    } catch (e) {
      const current =
        e instanceof ApiError ? (e.failure.details as { current?: WorkCalendarView })?.current : undefined;
      if (current) {
        setSaved(current);
        setWeekdays(current.weekdays);
        setHolidays(current.holidays);
      }
      setStatus({
        tone: 'invalid',
        text: failureMessage(e, 'The server could not be reached. Nothing was saved.'),
      });
    } finally {
      setSaving(false);
    }
  };

  const shownYear = holidays.filter((h) => h.date.startsWith(`${year}-`));

  return (
    <div className="space-y-4">
      <Card title="Working week">
        <fieldset disabled={!canEdit} className="flex flex-wrap gap-2" aria-label="Working weekdays">
          {WEEKDAYS.map(([day, label]) => (
            <label
              key={day}
              className={`flex cursor-pointer items-center gap-1.5 rounded border px-2.5 py-1 text-sm ${
                weekdays.includes(day)
                  ? 'border-time bg-time-light text-ink'
                  : 'border-rule-strong text-ink-soft'
              }`}
            >
              <input
                type="checkbox"
                className="accent-time"
                checked={weekdays.includes(day)}
                onChange={() => toggleDay(day)}
              />
              {label}
            </label>
          ))}
        </fieldset>
        <p className="mt-2 text-sm text-ink-soft">
          {weekdays.length ? `Work is counted ${calendarText({ weekdays, holidays: [] })}.` : null}
        </p>
        {weekdays.length === 0 ? <Notice tone="invalid">Choose at least one working weekday.</Notice> : null}
      </Card>

      <Card
        title="Holidays"
        actions={
          canEdit ? (
            <label className="cursor-pointer text-sm text-cost-dark underline">
              Import dates from a CSV file
              <input
                type="file"
                accept=".csv,text/csv"
                className="sr-only"
                onChange={(e) => {
                  const file = e.target.files?.[0];
                  e.target.value = '';
                  if (file) void importFile(file);
                }}
              />
            </label>
          ) : null
        }
      >
        <HolidayYear
          year={year}
          years={years}
          onYear={setYear}
          holidays={shownYear}
          canEdit={canEdit}
          onRemove={(date) => setHolidays((list) => list.filter((h) => h.date !== date))}
        />
        {canEdit ? (
          <div className="mt-3 flex flex-wrap items-end gap-2">
            <label className="text-sm text-ink-soft">
              Date
              <TextInput
                type="date"
                value={newDate}
                onChange={(e) => setNewDate(e.target.value)}
                className="mt-1 w-44"
              />
            </label>
            <label className="text-sm text-ink-soft">
              Name (optional)
              <TextInput
                value={newName}
                maxLength={120}
                onChange={(e) => setNewName(e.target.value)}
                className="mt-1 w-64"
              />
            </label>
            <Button variant="secondary" onClick={addOne}>
              Add holiday
            </Button>
          </div>
        ) : null}
        <p className="mt-3 text-xs text-ink-faint">
          A CSV file lists one holiday a line: the date as YYYY-MM-DD, then an optional name. A holiday on a
          day that is not worked changes nothing.
        </p>
      </Card>

      {canEdit ? (
        <div className="flex items-center gap-3">
          <Button onClick={save} disabled={!dirty || saving || weekdays.length === 0}>
            {saving ? 'Saving…' : 'Save calendar'}
          </Button>
          <span className="text-sm text-ink-soft" aria-live="polite">
            {dirty ? 'Changes not saved yet.' : 'All changes saved.'}
          </span>
        </div>
      ) : null}
      <div aria-live="polite">
        {status ? (
          <Notice tone={status.tone}>
            {status.text}
            {status.lines?.length ? (
              <ul className="mt-1 list-disc pl-5">
                {status.lines.map((l) => (
                  <li key={l}>{l}</li>
                ))}
              </ul>
            ) : null}
          </Notice>
        ) : null}
      </div>
    </div>
  );
}
