import { z } from 'zod';

// The kinds of things Kitlane tells people about. The database enum (server/db/schema/messages.ts) is
// built from this list, so the settings page and the server can never disagree about a kind.
export const NOTIFICATION_KINDS = [
  'brief_invite',
  'quote_received',
  'quote_accepted',
  'quote_declined',
  'package_confirm',
  'message_digest',
  'booking_update',
  'payment',
  'delivery',
  'dispute',
] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];

/** Words for the settings page and the unsubscribe link ("Stop mails about …"). */
export const NOTIFICATION_KIND_LABELS: Record<NotificationKind, string> = {
  brief_invite: 'Invitations to a brief',
  quote_received: 'New quotes on my briefs',
  quote_accepted: 'My quote was accepted',
  quote_declined: 'My quote was declined',
  package_confirm: 'Requests to confirm a mic package',
  message_digest: 'Unread messages (one digest mail)',
  booking_update: 'Booking changes',
  payment: 'Payments and payouts',
  delivery: 'Deliveries and their checks',
  dispute: 'Disputes',
};

export function isNotificationKind(value: unknown): value is NotificationKind {
  return typeof value === 'string' && (NOTIFICATION_KINDS as readonly string[]).includes(value);
}

export const notificationKindSchema = z.enum(NOTIFICATION_KINDS, 'Unknown notification kind');

export const markNotificationsReadInputSchema = z.strictObject({
  /** One notification; without it every unread one is marked read. */
  id: z.string().min(1).max(100).optional(),
});
export type MarkNotificationsReadInput = z.infer<typeof markNotificationsReadInputSchema>;

export const notificationSettingsInputSchema = z.strictObject({
  mutedKinds: z.array(notificationKindSchema).max(NOTIFICATION_KINDS.length * 2),
});
export type NotificationSettingsInput = z.infer<typeof notificationSettingsInputSchema>;

export const listNotificationsQuerySchema = z.strictObject({
  limit: z.coerce.number().int().min(1).max(100).default(30),
});
export type ListNotificationsQuery = z.infer<typeof listNotificationsQuerySchema>;

// What the API answers. Dates travel as ISO strings.
export type NotificationItem = {
  id: string;
  kind: NotificationKind;
  title: string;
  body: string;
  link: string;
  readAt: string | null;
  createdAt: string;
};
export type NotificationList = { items: NotificationItem[]; unread: number };
export type NotificationSettings = { mutedKinds: NotificationKind[] };
export type UnreadCounts = { messages: number; notifications: number };

/** The settings page path a mail footer links to; `kind` preselects the kind to stop. */
export function notificationSettingsPath(kind?: NotificationKind): string {
  return kind ? `/notifications/settings?mute=${kind}` : '/notifications/settings';
}
