import { z } from 'zod';
import { ROLES } from '@/lib/auth/roles';

// 254 characters is the longest address SMTP can carry (RFC 5321, section 4.5.3.1.3, as
// corrected by erratum 1690), and the width of the stored column.
export const EMAIL_MAX = 254;

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(EMAIL_MAX, { message: `Use an e-mail address of at most ${EMAIL_MAX} characters.` })
  .pipe(z.email({ message: 'Enter a valid e-mail address, like name@company.com.' }));

export const passwordSchema = z
  .string()
  .min(10, { message: 'Use at least 10 characters for the password.' })
  .max(200, { message: 'Use at most 200 characters for the password.' });

export const personNameSchema = z
  .string()
  .trim()
  .min(1, { message: 'Enter your name.' })
  .max(120, { message: 'Keep the name under 120 characters.' });

export const signUpSchema = z.object({
  name: personNameSchema,
  organizationName: z
    .string()
    .trim()
    .min(2, { message: 'Enter the organisation name (at least 2 characters).' })
    .max(120, { message: 'Keep the organisation name under 120 characters.' }),
  email: emailSchema,
  password: passwordSchema,
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, { message: 'Enter your password.' }),
});

export const roleSchema = z.enum(ROLES, { message: 'Choose one of: owner, estimator, sponsor, billing.' });

export const inviteSchema = z.object({ email: emailSchema, role: roleSchema });
export const changeRoleSchema = z.object({ role: roleSchema });

/** A new account made by accepting an invitation while signed out. */
export const acceptInvitationSchema = z.object({
  name: personNameSchema,
  password: passwordSchema,
});
