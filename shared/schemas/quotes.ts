// A drummer's quote on a brief. The client sends prices as integer minor units of the brief's currency;
// the server builds the line items and the total from them, so no client can choose its own total.
import { z } from 'zod';
import { amountMinorSchema, calendarDateSchema } from './briefs';

export const QUOTE_STATUSES = ['sent', 'accepted', 'declined', 'withdrawn', 'expired'] as const;
export type QuoteStatus = (typeof QUOTE_STATUSES)[number];

export const RIGHTS_TERMS = ['buyout', 'credit', 'points'] as const;
export type RightsTerms = (typeof RIGHTS_TERMS)[number];

/** Plain words for each kind of rights terms (common practice in session work). */
export const RIGHTS_LABELS: Record<RightsTerms, { title: string; explain: string }> = {
  buyout: {
    title: 'Work-for-hire buyout',
    explain: 'The songwriter pays once and owns the recorded drum parts outright; the drummer keeps no share in the recording.',
  },
  credit: {
    title: 'Credit required',
    explain: 'The songwriter owns the recording, and the drummer must be credited by name wherever players are listed.',
  },
  points: {
    title: 'Royalty points',
    explain: 'Besides the fee, the drummer receives the stated number of points: percent of the recording royalties the songwriter receives.',
  },
};

export const LEGAL_CAUTION =
  'These are plain-words summaries, not legal advice. Rights and royalties depend on local law and on the contracts you sign; ask a qualified professional when in doubt.';

export const QUOTE_VALIDITY_DAYS = { min: 1, max: 60, default: 14 } as const;
export const ROYALTY_POINT_LIMITS = { min: 0.25, max: 50 } as const;

export const quoteInputSchema = z
  .strictObject({
    perSongFeeMinor: amountMinorSchema.min(1, 'Enter your fee per song'),
    rushFeeMinor: amountMinorSchema.default(0),
    extraRevisionMinor: amountMinorSchema.default(0),
    revisionsIncluded: z.number({ error: 'Enter how many revisions are included' }).int().min(0, 'At least 0').max(10, 'At most 10'),
    turnaroundDays: z.number({ error: 'Enter the turnaround in days' }).int('Whole days').min(1, 'At least 1 day').max(180, 'At most 180 days'),
    recordingDate: calendarDateSchema.nullable().default(null),
    rightsTerms: z.enum(RIGHTS_TERMS, 'Pick buyout, credit or royalty points'),
    royaltyPoints: z
      .number()
      .min(ROYALTY_POINT_LIMITS.min, `At least ${ROYALTY_POINT_LIMITS.min} points`)
      .max(ROYALTY_POINT_LIMITS.max, `At most ${ROYALTY_POINT_LIMITS.max} points`)
      .nullable()
      .default(null),
    message: z.string().trim().max(2000, 'Use at most 2000 characters').default(''),
    validDays: z
      .number()
      .int()
      .min(QUOTE_VALIDITY_DAYS.min, `At least ${QUOTE_VALIDITY_DAYS.min} day`)
      .max(QUOTE_VALIDITY_DAYS.max, `At most ${QUOTE_VALIDITY_DAYS.max} days`)
      .default(QUOTE_VALIDITY_DAYS.default),
    /** An engineer's mic package (rooms issue). */
    packageId: z.string().trim().min(1).max(64).nullable().default(null),
    /** Until packages exist: name the engineer and their share directly. */
    engineerId: z.string().trim().min(1).max(64).nullable().default(null),
    engineerShareMinor: amountMinorSchema.nullable().default(null),
  })
  .superRefine((v, ctx) => {
    if (v.rightsTerms === 'points' && v.royaltyPoints == null) {
      ctx.addIssue({ code: 'custom', path: ['royaltyPoints'], message: 'Say how many royalty points' });
    }
    if (v.rightsTerms !== 'points' && v.royaltyPoints != null) {
      ctx.addIssue({ code: 'custom', path: ['royaltyPoints'], message: 'Royalty points only go with the royalty points terms' });
    }
    if ((v.engineerId == null) !== (v.engineerShareMinor == null)) {
      ctx.addIssue({ code: 'custom', path: ['engineerShareMinor'], message: 'Name the engineer together with their share' });
    }
    if (v.packageId != null && v.engineerId != null) {
      ctx.addIssue({ code: 'custom', path: ['packageId'], message: 'Pick a mic package or name an engineer, not both' });
    }
  });
export type QuoteInput = z.input<typeof quoteInputSchema>;
export type QuoteValues = z.output<typeof quoteInputSchema>;

export const declineQuoteInputSchema = z.strictObject({
  reason: z.string().trim().max(500, 'Use at most 500 characters').optional(),
});
export type DeclineQuoteInput = z.infer<typeof declineQuoteInputSchema>;

export const engineerResponseInputSchema = z.strictObject({ confirm: z.boolean({ error: 'Say yes or no' }) });
export type EngineerResponseInput = z.infer<typeof engineerResponseInputSchema>;

export type QuoteLineItemView = { kind: 'per_song' | 'package' | 'rush' | 'extra_revision' | 'other'; label: string; unitAmount: number; quantity: number };

export type QuoteView = {
  id: string;
  briefId: string;
  briefTitle: string;
  drummerId: string;
  drummerName: string;
  status: QuoteStatus;
  lineItems: QuoteLineItemView[];
  totalMinor: number;
  currency: string;
  drummerShareMinor: number;
  revisionsIncluded: number;
  extraRevisionMinor: number;
  turnaroundDays: number;
  recordingDate: string | null;
  rightsTerms: RightsTerms;
  royaltyPoints: number | null;
  message: string;
  validUntil: string;
  packageId: string | null;
  engineer: { id: string; displayName: string; shareMinor: number; status: 'pending' | 'confirmed' | 'declined' } | null;
  declineReason: string | null;
  /** Why the songwriter cannot accept it now, or null when they can. */
  blockedReason: string | null;
  createdAt: string;
};

/** One column of the side-by-side comparison the brief's owner sees. */
export type QuoteComparison = QuoteView & {
  drummer: { ratingAvg: number | null; ratingCount: number; reelTrackId: string | null; reelTrackTitle: string | null };
};

export type QuoteList<T = QuoteView> = { items: T[]; total: number };
