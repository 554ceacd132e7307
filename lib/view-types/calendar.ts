/** The organisation's calendar as pages and the API show it. */
export type WorkCalendarView = {
  /** ISO weekdays worked, 1 = Monday … 7 = Sunday, ascending. */
  weekdays: number[];
  holidays: { date: string; name: string }[];
  /** Send back with a change; a change from an older version is refused (0: never saved). */
  version: number;
  /** False while the organisation keeps the default Monday-to-Friday week with no holidays. */
  customised: boolean;
};
