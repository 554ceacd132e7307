import { z } from 'zod';

export const ESTIMATE_CLASSES = [1, 2, 3, 4, 5] as const;
export const STAGES = [
  'Concept',
  'Feasibility',
  'Preliminary design',
  'Detailed design',
  'Tender',
  'Delivery',
] as const;

/** Blank form fields mean "no target"; a typed amount may carry spaces or thousands commas. */
const blankToNull = (v: unknown) => (v === '' || (typeof v === 'string' && v.trim() === '') ? null : v);
const amount = (v: unknown) => (typeof v === 'string' ? Number(v.replace(/[\s,]/g, '')) : v);
const costTargetMessage = 'Enter the cost target as an amount greater than 0, or leave it blank.';

const projectFields = z.object({
  name: z.string().trim().min(2, { message: 'Enter a project name (at least 2 characters).' }).max(160),
  code: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z0-9][A-Z0-9._-]{0,31}$/, {
      message: 'Use 1–32 letters, digits, dots, dashes or underscores.',
    }),
  currency: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{3}$/, { message: 'Use a three-letter ISO 4217 currency code, like EUR.' }),
  estimateClass: z.coerce
    .number()
    .int()
    .min(1, { message: 'Estimate class runs from 1 to 5.' })
    .max(5, { message: 'Estimate class runs from 1 to 5.' }),
  stage: z.enum(STAGES, { message: `Choose a stage: ${STAGES.join(', ')}.` }),
  baseDate: z.iso.date({ message: 'Enter the base date as YYYY-MM-DD.' }),
  description: z.string().trim().max(4000).optional().nullable(),
  // The targets each new run starts with; absent means "leave as they are", null means "none".
  costTarget: z
    .preprocess(
      (v) => amount(blankToNull(v)),
      z.number({ message: costTargetMessage }).positive({ message: costTargetMessage }).nullable(),
    )
    .optional(),
  finishTarget: z
    .preprocess(
      blankToNull,
      z.iso.date({ message: 'Enter the finish target as a date, YYYY-MM-DD, or leave it blank.' }).nullable(),
    )
    .optional(),
});

/** A finish target before the base date could never be met by any run. */
function finishAfterBase(p: { baseDate: string; finishTarget?: string | null }, ctx: z.RefinementCtx) {
  if (p.finishTarget && p.finishTarget < p.baseDate)
    ctx.addIssue({
      code: 'custom',
      path: ['finishTarget'],
      message: `The finish target must be on or after the base date, ${p.baseDate}.`,
    });
}

export const projectSchema = projectFields.superRefine(finishAfterBase);
export type ProjectInput = z.infer<typeof projectSchema>;

/** The version of the record that the client last read: a change to an older one is refused (409). */
export const readVersionField = z
  .number({ message: 'Send the version of the project you last read (a whole number).' })
  .int({ message: 'Send the version of the project you last read (a whole number).' })
  .positive({ message: 'Send the version of the project you last read (a whole number).' });

export const projectUpdateSchema = projectFields
  .extend({ version: readVersionField })
  .superRefine(finishAfterBase);
