import { z } from 'zod';

/** The most holidays one organisation keeps (about fifty years of a generous list). */
export const MAX_HOLIDAYS = 2000;

const weekday = z
  .number({ message: 'A weekday is a number from 1 (Monday) to 7 (Sunday).' })
  .int({ message: 'A weekday is a number from 1 (Monday) to 7 (Sunday).' })
  .min(1, { message: 'A weekday is a number from 1 (Monday) to 7 (Sunday).' })
  .max(7, { message: 'A weekday is a number from 1 (Monday) to 7 (Sunday).' });

const holiday = z.object({
  date: z.iso.date({ message: 'Enter the holiday as a date, YYYY-MM-DD.' }),
  name: z.string().trim().max(120, { message: 'Keep the holiday name to 120 characters.' }).default(''),
});

/** A change of the organisation's calendar: the whole calendar, from the version last read. */
export const workCalendarInputSchema = z
  .object({
    weekdays: z
      .array(weekday)
      .min(1, { message: 'Choose at least one working weekday.' })
      .refine((days) => new Set(days).size === days.length, { message: 'Name each weekday once.' }),
    holidays: z.array(holiday).max(MAX_HOLIDAYS, { message: `Keep at most ${MAX_HOLIDAYS} holidays.` }),
    version: z
      .number({ message: 'Send back the version of the calendar you read.' })
      .int({ message: 'Send back the version of the calendar you read.' })
      .min(0, { message: 'Send back the version of the calendar you read.' }),
  })
  .superRefine((input, ctx) => {
    const seen = new Map<string, number>();
    input.holidays.forEach((h, i) => {
      const first = seen.get(h.date);
      if (first !== undefined) {
        ctx.addIssue({
          code: 'custom',
          path: ['holidays', i, 'date'],
          message: `${h.date} is listed twice (also as holiday ${first + 1}).`,
        });
      } else seen.set(h.date, i);
    });
  });
export type WorkCalendarInput = z.input<typeof workCalendarInputSchema>;
