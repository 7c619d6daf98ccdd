import { z } from 'zod';
import { text } from './text';
import { ROLES } from '@/lib/roles';
import { isCommonPassword } from './common-passwords';

export const emailField = text({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .min(1, 'Enter your e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email('Enter a valid e-mail address, such as name@example.com.'));

export const newPasswordField = text({ error: 'Choose a password.' })
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.')
  .refine((p) => !isCommonPassword(p), 'That password is too common; choose another.');

export const nameField = text({ error: 'Enter your name.' }).trim().min(1, 'Enter your name.').max(120, 'Use at most 120 characters.');

/** The secret from an e-mailed link (only ever hashed and compared). */
const tokenField = text().min(10).max(200);

export const roleField = z.enum(ROLES, { error: 'Choose a role.' });

export const signUpSchema = z.object({ name: nameField, email: emailField, password: newPasswordField });
export const signInSchema = z.object({ email: emailField, password: text().min(1, 'Enter your password.').max(200) });
export const requestResetSchema = z.object({ email: emailField });
export const resetPasswordSchema = z.object({ token: tokenField, password: newPasswordField });
export const changePasswordSchema = z.object({ currentPassword: text().min(1, 'Enter your current password.').max(200), password: newPasswordField });
export const createOrganisationSchema = z.object({
  name: text().trim().min(2, 'Use at least 2 characters.').max(120, 'Use at most 120 characters.'),
});
export const inviteMemberSchema = z.object({ email: emailField, role: roleField });
export const changeRoleSchema = z.object({ membershipId: z.uuid('Unknown member.'), role: roleField });
export const memberIdSchema = z.object({ membershipId: z.uuid('Unknown member.') });
export const invitationIdSchema = z.object({ invitationId: z.uuid('Unknown invitation.') });
export const acceptInvitationNewUserSchema = z.object({ token: tokenField, name: nameField, password: newPasswordField });
export const acceptInvitationSchema = z.object({ token: tokenField });

export type SignUpInput = z.infer<typeof signUpSchema>;

/** The renewal threshold an owner may set, percent of the original anode mass remaining. */
export const RENEWAL_THRESHOLD_PERCENT = { min: 5, max: 60, default: 25 } as const;

/** The owner's organisation settings (the Team page). */
export const organisationSettingsSchema = z.object({
  name: text().trim().min(2, 'Use at least 2 characters.').max(120, 'Use at most 120 characters.'),
  renewalMarginMonths: z.coerce.number({ error: 'Enter a whole number of months.' }).int('Enter a whole number of months.').min(0, 'The margin cannot be negative.').max(36, 'Use at most 36 months.'),
  renewalThresholdPercent: z.coerce
    .number({ error: 'Enter a whole percentage.' })
    .int('Enter a whole percentage.')
    .min(RENEWAL_THRESHOLD_PERCENT.min, `Use at least ${RENEWAL_THRESHOLD_PERCENT.min} %.`)
    .max(RENEWAL_THRESHOLD_PERCENT.max, `Use at most ${RENEWAL_THRESHOLD_PERCENT.max} %.`),
  fittingRatePerKg: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.coerce.number({ error: 'Enter a number.' }).min(0, 'The rate cannot be negative.').max(100_000).nullable()),
  currency: text().trim().regex(/^[A-Z]{3}$/, 'Use a three-letter currency code such as EUR.'),
});
