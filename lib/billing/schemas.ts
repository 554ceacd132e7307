import { z } from 'zod';
import { MAX_SEATS } from './plan';

const seats = z.coerce
  .number({ message: 'Enter the number of seats, like 5.' })
  .int({ message: 'Enter a whole number of seats.' })
  .min(1, { message: 'Buy at least 1 seat.' })
  .max(MAX_SEATS, { message: `Buy at most ${MAX_SEATS} seats at once; write to us for more.` });

export const seatsSchema = z.object({ seats });
export type SeatsInput = z.input<typeof seatsSchema>;

/** The proration date of the preview that was shown, so that the charge matches it. */
export const changeSeatsSchema = z.object({
  seats,
  prorationDate: z.coerce
    .number({ message: 'The proration date must be a Unix time in seconds.' })
    .int({ message: 'The proration date must be a Unix time in seconds.' })
    .positive({ message: 'The proration date must be a Unix time in seconds.' })
    .optional(),
});
