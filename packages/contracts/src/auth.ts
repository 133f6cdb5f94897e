import { z } from 'zod';

export const ROLES = ['owner', 'estimator', 'installer'] as const;
export const Role = z.enum(ROLES);
export type Role = z.infer<typeof Role>;

export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  estimator: 'Estimator',
  installer: 'Installer',
};

export const MIN_PASSWORD_LENGTH = 10;
export const MAX_PASSWORD_LENGTH = 200;

export const Email = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'An e-mail address is at most 254 characters.')
  .pipe(z.email('Enter an e-mail address like name@example.com.'));

export const NewPassword = z
  .string()
  .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters.`)
  .max(MAX_PASSWORD_LENGTH, `Use at most ${MAX_PASSWORD_LENGTH} characters.`);

export const PersonName = z.string().trim().min(1, 'Enter a name.').max(120, 'A name is at most 120 characters.');

/** A single-use token from an e-mailed link. */
export const EmailToken = z
  .string()
  .min(20, 'This link is incomplete.')
  .max(200, 'This link is not valid.')
  .regex(/^[A-Za-z0-9_-]+$/, 'This link is not valid.');

export const SessionUser = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: Role,
  organization: z.object({ id: z.string(), name: z.string() }),
});
export type SessionUser = z.infer<typeof SessionUser>;

// POST /api/session
export const SignInRequest = z.object({
  email: Email,
  password: z.string().min(1, 'Enter your password.').max(MAX_PASSWORD_LENGTH),
});
export type SignInRequest = z.infer<typeof SignInRequest>;

// POST /api/session, GET /api/session
export const SessionResponse = z.object({ user: SessionUser });
export type SessionResponse = z.infer<typeof SessionResponse>;

// POST /api/invites (owner)
export const InviteRequest = z.object({
  email: Email,
  name: PersonName,
  role: Role,
});
export type InviteRequest = z.infer<typeof InviteRequest>;

export const TeamMember = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: Role,
  status: z.enum(['active', 'invited', 'deactivated']),
});
export type TeamMember = z.infer<typeof TeamMember>;

export const InviteResponse = z.object({ user: TeamMember });
export type InviteResponse = z.infer<typeof InviteResponse>;

// GET /api/users (owner)
export const TeamResponse = z.object({ users: z.array(TeamMember) });
export type TeamResponse = z.infer<typeof TeamResponse>;

// POST /api/invites/accept
export const AcceptInviteRequest = z.object({
  token: EmailToken,
  password: NewPassword,
});
export type AcceptInviteRequest = z.infer<typeof AcceptInviteRequest>;

// POST /api/password-resets
export const PasswordResetRequest = z.object({ email: Email });
export type PasswordResetRequest = z.infer<typeof PasswordResetRequest>;

// POST /api/password-resets/complete
export const PasswordResetComplete = z.object({
  token: EmailToken,
  password: NewPassword,
});
export type PasswordResetComplete = z.infer<typeof PasswordResetComplete>;

/** Answer for requests whose outcome is only "accepted" (never reveals whether an account exists). */
export const Accepted = z.object({ ok: z.literal(true), message: z.string() });
export type Accepted = z.infer<typeof Accepted>;

// PATCH /api/users/:id (owner): change the role, deactivate or reactivate
export const UpdateTeamMemberRequest = z
  .object({
    role: Role.optional(),
    active: z.boolean('Say true or false.').optional(),
  })
  .refine((r) => r.role !== undefined || r.active !== undefined, { message: 'Send a role, or active true/false.', path: ['role'] });
export type UpdateTeamMemberRequest = z.infer<typeof UpdateTeamMemberRequest>;

export const TeamMemberResponse = z.object({ user: TeamMember });
export type TeamMemberResponse = z.infer<typeof TeamMemberResponse>;
