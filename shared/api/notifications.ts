import { z } from 'zod';

/** What a notification is about (more kinds come with seats, payments and certificates). */
export const NOTIFICATION_KINDS = ['answer-graded', 'answer-overridden', 'answer-regraded'] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];

/** One in-app notification for the signed-in user. */
export interface NotificationView {
  id: string;
  kind: NotificationKind;
  title: string;
  /** Plain text (never HTML). */
  body: string;
  /** An app path to open ("/course/pressure/quiz?attempt=…"), or null. */
  link: string | null;
  createdAt: string;
  readAt: string | null;
}

/** `GET /api/notifications`: the newest first, and how many are unread in all. */
export interface NotificationsPage {
  items: NotificationView[];
  unread: number;
}

export const notificationsQuerySchema = z
  .object({
    limit: z.coerce.number().int().min(1).max(100).default(20),
    unread: z.enum(['true', 'false']).optional(),
  })
  .strict();
export type NotificationsQuery = z.infer<typeof notificationsQuerySchema>;

/** `POST /api/notifications/read`: mark some (by id) or all of one's notifications read. */
export const markReadSchema = z.union([
  z.object({ ids: z.array(z.string().uuid()).min(1).max(100) }).strict(),
  z.object({ all: z.literal(true) }).strict(),
]);
export type MarkReadRequest = z.infer<typeof markReadSchema>;

/** The answer to `POST /api/notifications/read`: how many are still unread. */
export interface UnreadCount {
  unread: number;
}
