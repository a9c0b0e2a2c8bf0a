import { z } from 'zod';

/** Who someone is in Flowlore. The server decides; a role sent by a client is never trusted. */
export const ROLES = ['apprentice', 'instructor', 'shop_owner', 'admin'] as const;
export type Role = (typeof ROLES)[number];

/** The units a reader works in: SI, or US customary (the calculators' US/SI switch). */
export const UNIT_SYSTEMS = ['si', 'us'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

export const emailAddress = z.string().trim().toLowerCase().pipe(z.email({ error: 'Enter an e-mail address like name@example.com.' })).pipe(z.string().max(254));
const email = emailAddress;
/** Length only: at least 8 characters, no composition rules; long passphrases welcome (up to 1000). */
const newPassword = z.string().min(8, 'Use at least 8 characters.').max(1000, 'Use at most 1000 characters.');
const anyPassword = z.string().min(1, 'Enter your password.').max(1000);
const displayName = z.string().trim().min(1, 'Enter a name.').max(100);
const token = z.string().min(16).max(200);

/** `POST /api/auth/sign-up`: an apprentice, or a shop owner who names a shop. */
export const signUpSchema = z.discriminatedUnion('accountType', [
  z.object({ accountType: z.literal('apprentice'), email, displayName, password: newPassword }).strict(),
  z
    .object({ accountType: z.literal('shop_owner'), email, displayName, password: newPassword, shopName: z.string().trim().min(2).max(120) })
    .strict(),
]);
export type SignUpRequest = z.infer<typeof signUpSchema>;

/**
 * `cli.js create-user`: an operator creates a verified account of any role, with the sign-up rules
 * for each field; a shop owner names their new shop, an apprentice may name an existing shop to join.
 */
export const createUserSchema = z
  .object({ email, displayName, role: z.enum(ROLES), password: newPassword, shopName: z.string().trim().min(2).max(120).optional() })
  .strict()
  .superRefine((value, ctx) => {
    if (value.role === 'shop_owner' && !value.shopName) ctx.addIssue({ code: 'custom', path: ['shopName'], message: 'A shop owner needs a shop: give --shop "Shop name".' });
    if ((value.role === 'instructor' || value.role === 'admin') && value.shopName) {
      ctx.addIssue({ code: 'custom', path: ['shopName'], message: 'Only a shop owner (a new shop) or an apprentice (an existing shop to join) takes --shop: leave it out.' });
    }
  });
export type CreateUserRequest = z.infer<typeof createUserSchema>;

export const signInSchema = z.object({ email, password: anyPassword }).strict();
export type SignInRequest = z.infer<typeof signInSchema>;

export const verifyEmailSchema = z.object({ token }).strict();
export const forgotPasswordSchema = z.object({ email }).strict();
export const resetPasswordSchema = z.object({ token, password: newPassword }).strict();
export const changePasswordSchema = z.object({ currentPassword: anyPassword, newPassword }).strict();
export const profileSchema = z.object({ displayName }).strict();

/** `PATCH /api/account/preferences`: the reader's choices that follow the account to any device. */
export const preferencesSchema = z
  .object({ unitSystem: z.enum(UNIT_SYSTEMS, { error: 'Choose "si" or "us".' }) })
  .strict();
export type PreferencesRequest = z.infer<typeof preferencesSchema>;

/** `PATCH /api/admin/users/:id`: a new role and/or enabling/disabling the account. */
export const adminUserChangeSchema = z
  .object({ role: z.enum(ROLES).optional(), disabled: z.boolean().optional() })
  .strict()
  .refine((v) => v.role !== undefined || v.disabled !== undefined, { error: 'Send a role, disabled, or both.' });
export type AdminUserChange = z.infer<typeof adminUserChangeSchema>;

/** `GET /api/admin/users` query. */
export const adminUserQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  role: z.enum(ROLES).optional(),
  sort: z.enum(['email', 'displayName', 'createdAt', 'role']).default('createdAt'),
  order: z.enum(['asc', 'desc']).default('desc'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});
export type AdminUserQuery = z.infer<typeof adminUserQuerySchema>;

export const pageQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});

export const createCohortSchema = z.object({ name: z.string().trim().min(2).max(120) }).strict();
/** Add an apprentice to a cohort by e-mail or by id. */
export const addCohortMemberSchema = z.union([z.object({ email }).strict(), z.object({ userId: z.uuid() }).strict()]);

/** The signed-in user as the app sees them (`GET /api/auth/me` → `{ user }`, null for a visitor). */
export interface Account {
  id: string;
  email: string;
  displayName: string;
  role: Role;
  verified: boolean;
  shopId: string | null;
  /** The units saved with the account; null until the user first switches (the browser's choice holds). */
  unitSystem: UnitSystem | null;
}
export interface MeResponse {
  user: Account | null;
}

export interface UserSummary {
  id: string;
  email: string;
  displayName: string;
  role: Role;
  verified: boolean;
  disabled: boolean;
  shopId: string | null;
  createdAt: string;
}

export interface Page<T> {
  items: T[];
  page: number;
  pageSize: number;
  total: number;
}

export interface CohortSummary {
  id: string;
  name: string;
  instructor: { id: string; displayName: string };
  memberCount: number;
  createdAt: string;
}
export interface CohortMemberView {
  id: string;
  email: string;
  displayName: string;
  addedAt: string;
}
export interface CohortDetail extends CohortSummary {
  members: CohortMemberView[];
}

export interface ShopView {
  id: string;
  name: string;
  owner: { id: string; displayName: string };
  apprentices: Array<{ id: string; email: string; displayName: string; verified: boolean }>;
}

export interface OutboxEntry {
  id: string;
  to: string;
  subject: string;
  template: string;
  status: 'sent' | 'failed';
  error: string | null;
  sentAt: string | null;
  createdAt: string;
  userId: string | null;
  text: string;
}

export interface AuditView {
  id: string;
  actorId: string | null;
  targetId: string | null;
  /** Who acted, by name (null: the command line, or an account since deleted). */
  actor: { id: string; displayName: string; email: string } | null;
  /** Whose account it was about, by name (null when none, or deleted). */
  target: { id: string; displayName: string; email: string } | null;
  action: string;
  detail: Record<string, unknown>;
  at: string;
}

/** `GET /api/auth/demo-accounts` (demo mode only): the seeded sign-ins for the sign-in page. */
export interface DemoAccount {
  email: string;
  displayName: string;
  role: Role;
  password: string;
}
