// The prep checklist of a booking with a room: what the engineer and drummer make sure of before the first
// take. The items are common practice in the trade (issue 6); each says who usually sees to it, but either
// of the two may tick any item, and every tick is recorded with who and when.
import { z } from 'zod';

export const PREP_ITEM_IDS = [
  'kit_set_before_mics',
  'no_squeaks',
  'stands_decoupled',
  'cables_routed_labelled',
  'tall_stands_weighted',
  'hearing_protection',
  'drummer_asked_about_mics',
] as const;
export type PrepItemId = (typeof PREP_ITEM_IDS)[number];

export type PrepItem = { id: PrepItemId; label: string; why: string; usually: 'drummer' | 'engineer' | 'both'; basis: 'common practice' };

export const PREP_ITEMS: readonly PrepItem[] = [
  {
    id: 'kit_set_before_mics',
    label: 'The drummer has set up and adjusted the kit before any mic is placed',
    why: 'Moving a drum or cymbal afterwards means moving every mic again.',
    usually: 'drummer',
    basis: 'common practice',
  },
  {
    id: 'no_squeaks',
    label: 'No squeaks: pedals oiled, screws and wing nuts tight',
    why: 'Close mics hear every squeak and rattle, and they cannot be removed later.',
    usually: 'drummer',
    basis: 'common practice',
  },
  {
    id: 'stands_decoupled',
    label: 'Stands decoupled from the floor and not touching the kit or each other',
    why: 'A stand touching the kit or another stand puts subsonic noise on the tracks.',
    usually: 'engineer',
    basis: 'common practice',
  },
  {
    id: 'cables_routed_labelled',
    label: 'Cables routed and labelled',
    why: 'A faulty mic or cable can be swapped quickly, and nobody trips.',
    usually: 'engineer',
    basis: 'common practice',
  },
  {
    id: 'tall_stands_weighted',
    label: 'Tall stands weighted',
    why: 'Tall room-mic stands are top-heavy and fall easily.',
    usually: 'engineer',
    basis: 'common practice',
  },
  {
    id: 'hearing_protection',
    label: 'Hearing protection at hand',
    why: "A kit at the player's seat is commonly above 100 dBA.",
    usually: 'both',
    basis: 'common practice',
  },
  {
    id: 'drummer_asked_about_mics',
    label: 'The drummer has been asked whether any mic is in the way',
    why: 'A mic in the way of a stick or a foot changes how the part is played, or gets hit.',
    usually: 'engineer',
    basis: 'common practice',
  },
];

export const prepTickInputSchema = z.object({
  done: z.boolean({ error: 'Say whether the item is done' }),
});
export type PrepTickInput = z.infer<typeof prepTickInputSchema>;

export const prepItemIdSchema = z.enum(PREP_ITEM_IDS, { error: 'There is no such checklist item' });
export const prepItemParamsSchema = z.object({ itemId: prepItemIdSchema });

export type PrepEventView = { itemId: PrepItemId; done: boolean; by: { id: string; displayName: string }; at: string };

export type PrepItemState = PrepItem & {
  done: boolean;
  /** The last change: who ticked (or unticked) it and when; null when nobody has touched it. */
  last: PrepEventView | null;
};

export type SessionPrepView = {
  bookingId: string;
  room: { id: string; name: string; town: string } | null;
  packageName: string | null;
  items: PrepItemState[];
  /** Every change in order, newest last: the record of who ticked what and when. */
  history: PrepEventView[];
  /** The reader is the booking's drummer or engineer and the booking is still open for prep. */
  canTick: boolean;
  doneCount: number;
};
