import { z } from 'zod';

/** The joint confidence an organisation may choose for the frontier, in whole percent. */
export const MIN_JOINT_CONFIDENCE = 50;
export const MAX_JOINT_CONFIDENCE = 95;
export const DEFAULT_JOINT_CONFIDENCE = 70;

const jointMessage = `The joint confidence is a whole percent from ${MIN_JOINT_CONFIDENCE} to ${MAX_JOINT_CONFIDENCE}.`;

export const jointConfidenceSchema = z
  .number({ message: jointMessage })
  .int({ message: jointMessage })
  .min(MIN_JOINT_CONFIDENCE, { message: jointMessage })
  .max(MAX_JOINT_CONFIDENCE, { message: jointMessage });

/** A change to the organisation's settings: any of them, at least one. */
export const organizationSettingsSchema = z
  .object({
    allowSelfApproval: z
      .boolean({
        message: 'allowSelfApproval is true (the person who started a run may approve it) or false.',
      })
      .optional(),
    jointConfidence: jointConfidenceSchema.optional(),
  })
  .refine((s) => s.allowSelfApproval !== undefined || s.jointConfidence !== undefined, {
    message: 'Send allowSelfApproval or jointConfidence (or both).',
  });
