import { z } from 'zod';
import { pageOf } from './list';
import { UNIT_SYSTEM_IDS } from '@/shared/units/unit-systems';
import { SeenVersionSchema } from './seen-version';

export const ROLES = ['admin', 'planner', 'reviewer', 'observer'] as const;
export const RoleSchema = z.enum(ROLES);
export type Role = z.infer<typeof RoleSchema>;

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  planner: 'Planner',
  reviewer: 'Reviewer',
  observer: 'Observer (field crew)',
};

const email = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .min(1, 'Enter your e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'That is not an e-mail address.' }));

/** bcrypt reads only the first 72 bytes of a password; a longer one would be silently cut. */
export const PASSWORD_MAX_BYTES = 72;

/** UTF-8 length, which is what bcrypt counts. */
export const passwordBytes = (password: string) => new TextEncoder().encode(password).length;

/** A new password: long enough to resist guessing, short enough for bcrypt (72 bytes). */
export const NewPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .min(10, 'Use at least 10 characters.')
  .refine(
    (p) => passwordBytes(p) <= PASSWORD_MAX_BYTES,
    `Use at most ${PASSWORD_MAX_BYTES} bytes: that is 72 plain letters, digits and signs; accented letters, other scripts and emoji take 2 to 4 bytes each.`,
  );

export const SignInRequestSchema = z.object({
  email,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200, 'That password is too long.'),
});
export type SignInRequest = z.infer<typeof SignInRequestSchema>;

export const OrganizationSchema = z.object({
  id: z.uuid(),
  name: z.string(),
});
export type Organization = z.infer<typeof OrganizationSchema>;

export const UserSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: RoleSchema,
  organization: OrganizationSchema,
  /** The person's own unit system for forms and read-outs; absent or null = each site's default units. */
  unitPreference: z.enum(UNIT_SYSTEM_IDS).nullish(),
});
export type User = z.infer<typeof UserSchema>;

/** `PATCH /me`: the signed-in person's own settings. */
export const MeUpdateSchema = z.object({
  /** metric (m, km), nautical (ft, nmi) or imperial (ft, mi); null = follow each site's default units. */
  unitPreference: z
    .enum(UNIT_SYSTEM_IDS, { error: 'Choose metric, nautical or imperial, or none to follow each site.' })
    .nullable(),
});
export type MeUpdate = z.infer<typeof MeUpdateSchema>;

export const MeResponseSchema = z.object({ user: UserSchema });
export type MeResponse = z.infer<typeof MeResponseSchema>;

/** A row of the administrator's user table. */
export const ManagedUserSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: RoleSchema,
  status: z.enum(['active', 'invited', 'deactivated']),
  /** ISO 8601, null when the user never signed in. */
  lastSignInAt: z.string().nullable(),
  version: z.number().int(),
});
export type ManagedUser = z.infer<typeof ManagedUserSchema>;

export const ManagedUserListSchema = pageOf(ManagedUserSchema);

export const InviteUserRequestSchema = z.object({
  email,
  name: z.string({ error: 'Enter a name.' }).trim().min(1, 'Enter a name.').max(120, 'Use at most 120 characters.'),
  role: RoleSchema,
});
export type InviteUserRequest = z.infer<typeof InviteUserRequestSchema>;

export const InviteUserResponseSchema = z.object({
  user: ManagedUserSchema,
  /** One-time link; valid for 7 days. */
  setPasswordUrl: z.string(),
  /** Whether the link was also e-mailed to the person. */
  mailed: z.boolean(),
});

export const UpdateUserRequestSchema = z
  .object({
    role: RoleSchema.optional(),
    active: z.boolean().optional(),
    /** The version the client last saw; a different current version is a 409. */
    version: SeenVersionSchema,
  })
  .refine((v) => v.role !== undefined || v.active !== undefined, {
    message: 'Change the role or the active state.',
    path: ['role'],
  });
export type UpdateUserRequest = z.infer<typeof UpdateUserRequestSchema>;

export const SetPasswordRequestSchema = z.object({
  token: z.string().min(20, 'This link is incomplete.').max(200),
  password: NewPasswordSchema,
});
