import { z } from 'zod';
import { emailSchema, paged, pagedQuerySchema, passwordSchema, roleSchema, searchTextSchema, textSchema, MAX_ID } from './common';

export const userSchema = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  disabled: z.boolean(),
  createdAt: z.string(),
  lastLoginAt: z.string().nullable(),
  version: z.number(),
});
export type User = z.infer<typeof userSchema>;
/** GET /api/users: a page of the workspace's members, searched by name or address, filtered by role. */
export const userListQuerySchema = pagedQuerySchema(['name', 'email', 'role', 'createdAt', 'lastLoginAt'], 'name').extend({
  q: searchTextSchema.optional(),
  role: roleSchema.optional(),
  disabled: z.enum(['true', 'false'], { error: 'must be true or false' }).transform((v) => v === 'true').optional(),
});
export type UserListQuery = z.output<typeof userListQuerySchema>;
export const userListResponseSchema = paged(userSchema);

/** Change a member's role or disable them; `version` guards against a stale edit (409). */
export const updateUserRequestSchema = z
  .object({
    role: roleSchema.optional(),
    disabled: z.boolean({ error: 'must be true or false' }).optional(),
    version: z.number({ error: 'is required' }).int().min(0).max(MAX_ID, `must be at most ${MAX_ID}`),
  })
  .refine((body) => body.role !== undefined || body.disabled !== undefined, {
    message: 'give a role or disabled to change',
    path: ['role'],
  });
export type UpdateUserRequest = z.infer<typeof updateUserRequestSchema>;

export const INVITATION_VALID_HOURS = 72;
export const PASSWORD_RESET_VALID_HOURS = 1;

export const invitationSchema = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  status: z.enum(['pending', 'accepted', 'expired', 'revoked']),
  invitedBy: z.string(),
  expiresAt: z.string(),
  createdAt: z.string(),
});
export type Invitation = z.infer<typeof invitationSchema>;
export const INVITATION_STATUSES = ['pending', 'accepted', 'expired', 'revoked'] as const;
/** GET /api/invitations: a page of the workspace's invitations, newest first unless asked, by status. */
export const invitationListQuerySchema = pagedQuerySchema(['createdAt', 'email', 'expiresAt'], '-createdAt').extend({
  status: z.enum(INVITATION_STATUSES, { error: `must be one of ${INVITATION_STATUSES.join(', ')}` }).optional(),
});
export type InvitationListQuery = z.output<typeof invitationListQuerySchema>;
export const invitationListResponseSchema = paged(invitationSchema);
/** `resent`: a pending invitation to this address in this workspace was replaced; its link no longer works. */
export const createInvitationResponseSchema = z.object({ invitation: invitationSchema, resent: z.boolean() });
export type CreateInvitationResponse = z.infer<typeof createInvitationResponseSchema>;

export const createInvitationRequestSchema = z.object({
  email: emailSchema,
  name: textSchema({ error: 'is required' }).trim().min(1, 'is required').max(120, 'must be at most 120 characters'),
  role: roleSchema,
});
export type CreateInvitationRequest = z.infer<typeof createInvitationRequestSchema>;

export const invitationTokenQuerySchema = z.object({
  token: textSchema({ error: 'is required' }).min(20, 'is not a valid invitation token').max(200, 'is not a valid invitation token'),
});
export const invitationLookupResponseSchema = z.object({
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  workspaceName: z.string(),
});
export const acceptInvitationRequestSchema = z.object({
  token: textSchema({ error: 'is required' }).min(20, 'is not a valid invitation token').max(200, 'is not a valid invitation token'),
  name: textSchema({ error: 'is required' }).trim().min(1, 'is required').max(120, 'must be at most 120 characters'),
  password: passwordSchema,
});
export type AcceptInvitationRequest = z.infer<typeof acceptInvitationRequestSchema>;
