import { z } from 'zod';

import type { SeatPricing } from '../billing/pricing';
import { emailAddress } from './accounts';

/** How long an invitation holds its seat. */
export const INVITATION_DAYS = 14;
export const MAX_INVITATIONS_PER_REQUEST = 50;

/** `POST /api/shop/invitations`: addresses to invite (pasted: one per line or separated by commas). */
export const inviteSchema = z
  .object({
    emails: z
      .array(emailAddress)
      .min(1, 'Give at least one e-mail address.')
      .max(MAX_INVITATIONS_PER_REQUEST, `At most ${MAX_INVITATIONS_PER_REQUEST} addresses at a time.`),
  })
  .strict();
export type InviteRequest = z.infer<typeof inviteSchema>;

/** `POST /api/shop/seats/assign`: a seat for an apprentice already linked to the shop. */
export const assignSeatSchema = z.object({ userId: z.uuid() }).strict();

/** `POST /api/invitations/accept`: the token from the invitation's link. */
export const acceptInvitationSchema = z.object({ token: z.string().min(16).max(200) }).strict();

export type SeatState = 'invited' | 'assigned';

/** One seat in use, as the shop owner's seat table shows it. */
export interface SeatRow {
  seatId: string;
  state: SeatState;
  /** The apprentice holding it (assigned), or null while an invitation holds it. */
  holder: { id: string; displayName: string; email: string } | null;
  /** The invitation holding it, or that led to it. */
  invitation: { id: string; email: string; expiresAt: string; lastSentAt: string; sendCount: number } | null;
  since: string;
  /** Quizzes passed and lessons finished (from the gradebook's standing), for assigned seats. */
  progress: { lessonsFinished: number; quizzesPassed: number; lastActivity: string | null } | null;
}

/** `GET /api/shop/seats`: the shop's seat balance and the seats in use. */
export interface ShopSeats {
  /** What seats cost (volume tiers, minor units), for the price shown before buying. */
  pricing: SeatPricing;
  /** Whether this server takes payments (a provider is configured). */
  buying: boolean;
  purchased: number;
  refunded: number;
  inUse: number;
  available: number;
  seats: SeatRow[];
}

/** What `POST /api/shop/invitations` did with each address. */
export interface InviteResult {
  invited: Array<{ email: string; invitationId: string }>;
  /** Addresses not invited, each with the reason (already holds a seat here, asked twice …). */
  skipped: Array<{ email: string; reason: string }>;
  available: number;
}

/** `POST /api/invitations/accept`: the seat taken. */
export interface AcceptedInvitation {
  shop: { id: string; name: string };
  seatId: string;
}
