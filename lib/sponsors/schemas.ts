import { z } from 'zod';
import { channelSlugSchema } from '@/lib/channels/schemas';
import { dateSchema, durationSchema } from '@/lib/episodes/schemas';
import type { ApprovalLinkDto } from '@/lib/approvals/schemas';
import { scriptDocSchema, type ScriptDoc } from '@/lib/scripts/schemas';
import type { CheckResult } from '@/lib/sponsor-checks';
import { emailSchema } from '@/lib/users/schemas';
import { isCurrency } from './money';

export const deliverableKinds = ['segment_read', 'dedicated_segment', 'description_link', 'pinned_comment', 'social_post'] as const;
export type DeliverableKind = (typeof deliverableKinds)[number];
export const deliverableKindLabels: Record<DeliverableKind, string> = {
  segment_read: 'Read inside a segment',
  dedicated_segment: 'Dedicated segment',
  description_link: 'Description link',
  pinned_comment: 'Pinned comment',
  social_post: 'Social post',
};
/** The kinds that are spoken in the video, so the script checks apply. */
export const spokenKinds: readonly DeliverableKind[] = ['segment_read', 'dedicated_segment'];

export const dueDateKinds = ['script_due', 'approval_due', 'go_live', 'report_due', 'payment_due'] as const;
export type DueDateKind = (typeof dueDateKinds)[number];
export const dueDateLabels: Record<DueDateKind, string> = {
  script_due: 'Script due',
  approval_due: 'Approval due',
  go_live: 'Go-live',
  report_due: 'Report due',
  payment_due: 'Payment due',
};

export const invoiceStates = ['not_sent', 'sent', 'paid'] as const;
export type InvoiceState = (typeof invoiceStates)[number];
export const invoiceStateLabels: Record<InvoiceState, string> = { not_sent: 'Booked', sent: 'Invoiced', paid: 'Paid' };

const notes = z.string().trim().max(2000, 'Keep notes under 2,000 characters.');

const contactSchema = z.strictObject({
  name: z.string({ error: 'Give the contact a name.' }).trim().min(1, 'Give the contact a name.').max(120, 'Keep names under 120 characters.'),
  email: emailSchema,
});
export type SponsorContact = z.infer<typeof contactSchema>;

const sponsorFields = {
  name: z.string({ error: 'Give the sponsor a name.' }).trim().min(1, 'Give the sponsor a name.').max(120, 'Keep the name under 120 characters.'),
  contacts: z.array(contactSchema, { error: 'List the contacts.' }).max(10, 'Up to 10 contacts.'),
  notes,
};
export const createSponsorSchema = z.strictObject({
  name: sponsorFields.name,
  contacts: sponsorFields.contacts.default([]),
  notes: sponsorFields.notes.default(''),
});
export type CreateSponsorInput = z.infer<typeof createSponsorSchema>;
export const updateSponsorSchema = z
  .strictObject({ name: sponsorFields.name.optional(), contacts: sponsorFields.contacts.optional(), notes: sponsorFields.notes.optional() })
  .refine((v) => Object.keys(v).length > 0, 'Change at least one field.');
export type UpdateSponsorInput = z.infer<typeof updateSponsorSchema>;

const dealFields = {
  sponsorId: z.uuid({ error: 'Choose a sponsor.' }),
  title: z.string({ error: 'Give the deal a title.' }).trim().min(1, 'Give the deal a title.').max(160, 'Keep the title under 160 characters.'),
  feeMinor: z
    .number({ error: 'Enter the fee.' })
    .int('The fee is a whole number of minor units (cents).')
    .min(0, 'The fee cannot be negative.')
    .max(100_000_000_000, 'That fee is too large.'),
  // Source: ISO 4217 alphabetic codes, as Intl lists them (see money.ts).
  currency: z.string({ error: 'Choose a currency.' }).refine(isCurrency, 'Use an ISO 4217 currency code, like USD or EUR.'),
  paymentTermsDays: z.number({ error: 'Enter the payment terms in days.' }).int('Whole days.').min(0, 'At least 0 days.').max(365, 'At most 365 days.'),
  invoiceState: z.enum(invoiceStates, { error: 'Choose the invoice state.' }),
  invoiceSentOn: dateSchema.nullable(),
  paidOn: dateSchema.nullable(),
  notes,
};

type InvoiceFields = { invoiceState?: InvoiceState | undefined; invoiceSentOn?: string | null | undefined; paidOn?: string | null | undefined };
/** The invoice dates that go with a state; the field to blame when they do not fit. */
export function invoiceProblem(v: InvoiceFields): { field: 'invoiceSentOn' | 'paidOn'; message: string } | null {
  const state = v.invoiceState ?? 'not_sent';
  if (state !== 'not_sent' && !v.invoiceSentOn) return { field: 'invoiceSentOn', message: 'Give the date the invoice was sent.' };
  if (state === 'paid' && !v.paidOn) return { field: 'paidOn', message: 'Give the date it was paid.' };
  if (state !== 'paid' && v.paidOn) return { field: 'paidOn', message: 'Only a paid invoice has a paid date.' };
  if (state === 'not_sent' && v.invoiceSentOn) return { field: 'invoiceSentOn', message: 'An invoice not sent has no sent date.' };
  if (v.invoiceSentOn && v.paidOn && v.paidOn < v.invoiceSentOn) return { field: 'paidOn', message: 'Paid comes on or after the invoice date.' };
  return null;
}

export const createDealSchema = z
  .strictObject({
    sponsorId: dealFields.sponsorId,
    title: dealFields.title,
    feeMinor: dealFields.feeMinor,
    currency: dealFields.currency,
    paymentTermsDays: dealFields.paymentTermsDays.default(30),
    invoiceState: dealFields.invoiceState.default('not_sent'),
    invoiceSentOn: dealFields.invoiceSentOn.default(null),
    paidOn: dealFields.paidOn.default(null),
    notes: dealFields.notes.default(''),
  })
  .superRefine((v, ctx) => {
    const p = invoiceProblem(v);
    if (p) ctx.addIssue({ code: 'custom', message: p.message, path: [p.field] });
  });
export type CreateDealInput = z.infer<typeof createDealSchema>;

// Invoice fields travel together, so the check above can run on the whole state; the query re-checks
// against the stored row when only some are sent.
export const updateDealSchema = z
  .strictObject({
    title: dealFields.title.optional(),
    feeMinor: dealFields.feeMinor.optional(),
    currency: dealFields.currency.optional(),
    paymentTermsDays: dealFields.paymentTermsDays.optional(),
    invoiceState: dealFields.invoiceState.optional(),
    invoiceSentOn: dealFields.invoiceSentOn.optional(),
    paidOn: dealFields.paidOn.optional(),
    notes: dealFields.notes.optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'Change at least one field.');
export type UpdateDealInput = z.infer<typeof updateDealSchema>;

const phrase = z.string().trim().min(1, 'A must-say phrase cannot be empty.').max(200, 'Keep each phrase under 200 characters.');
export const placementSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('starts_before'), seconds: durationSchema }),
    z.strictObject({
      kind: z.literal('within_percent'),
      percent: z.number({ error: 'Enter a percentage.' }).int('A whole percentage.').min(1, 'At least 1 %.').max(100, 'At most 100 %.'),
    }),
  ],
  { error: 'Choose a placement rule.' },
);

const deliverableFields = {
  episodeId: z.uuid({ error: 'Choose the episode.' }),
  segmentId: z.uuid({ error: 'Choose the segment.' }).nullable(),
  kind: z.enum(deliverableKinds, { error: 'Choose what the deal asks for.' }),
  talkingPoints: scriptDocSchema.nullable(),
  mustSay: z.array(phrase, { error: 'List the must-say phrases.' }).max(20, 'Up to 20 must-say phrases.'),
  disclosure: z.string().trim().max(500, 'Keep the disclosure under 500 characters.'),
  tracking: z.string().trim().max(500, 'Keep the link or code under 500 characters.'),
  readMinSeconds: durationSchema.nullable(),
  readMaxSeconds: durationSchema.nullable(),
  placement: placementSchema.nullable(),
  ownerId: z.uuid({ error: 'Choose a crew member.' }).nullable(),
};
const rangeInOrder = (v: { readMinSeconds?: number | null | undefined; readMaxSeconds?: number | null | undefined }) =>
  v.readMinSeconds == null || v.readMaxSeconds == null || v.readMinSeconds <= v.readMaxSeconds;
const rangeMessage = { message: 'The longest read is at least the shortest.', path: ['readMaxSeconds'] };

export const dueDatesInputSchema = z.strictObject(Object.fromEntries(dueDateKinds.map((k) => [k, dateSchema.nullable().optional()])) as Record<DueDateKind, z.ZodOptional<z.ZodNullable<typeof dateSchema>>>);

export const createDeliverableSchema = z
  .strictObject({
    episodeId: deliverableFields.episodeId,
    segmentId: deliverableFields.segmentId.default(null),
    kind: deliverableFields.kind,
    talkingPoints: deliverableFields.talkingPoints.default(null),
    mustSay: deliverableFields.mustSay.default([]),
    disclosure: deliverableFields.disclosure.default(''),
    tracking: deliverableFields.tracking.default(''),
    readMinSeconds: deliverableFields.readMinSeconds.default(null),
    readMaxSeconds: deliverableFields.readMaxSeconds.default(null),
    placement: deliverableFields.placement.default(null),
    ownerId: deliverableFields.ownerId.default(null),
    dueDates: dueDatesInputSchema.default({}),
  })
  .refine(rangeInOrder, rangeMessage);
export type CreateDeliverableInput = z.infer<typeof createDeliverableSchema>;

export const updateDeliverableSchema = z
  .strictObject({
    episodeId: deliverableFields.episodeId.optional(),
    segmentId: deliverableFields.segmentId.optional(),
    kind: deliverableFields.kind.optional(),
    talkingPoints: deliverableFields.talkingPoints.optional(),
    mustSay: deliverableFields.mustSay.optional(),
    disclosure: deliverableFields.disclosure.optional(),
    tracking: deliverableFields.tracking.optional(),
    readMinSeconds: deliverableFields.readMinSeconds.optional(),
    readMaxSeconds: deliverableFields.readMaxSeconds.optional(),
    placement: deliverableFields.placement.optional(),
    ownerId: deliverableFields.ownerId.optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'Change at least one field.')
  .refine(rangeInOrder, rangeMessage);
export type UpdateDeliverableInput = z.infer<typeof updateDeliverableSchema>;

/** dueOn null clears the date (for Payment due: back to the derived date); done marks it done or open. */
export const updateDueDateSchema = z
  .strictObject({ dueOn: dateSchema.nullable().optional(), done: z.boolean({ error: 'Say whether it is done.' }).optional() })
  .refine((v) => v.dueOn !== undefined || v.done !== undefined, 'Change the date or mark it done.');
export type UpdateDueDateInput = z.infer<typeof updateDueDateSchema>;

export const sponsorParamsSchema = z.object({ channel: channelSlugSchema, sponsorId: z.uuid() });
export const dealParamsSchema = z.object({ channel: channelSlugSchema, dealId: z.uuid() });
export const deliverableParamsSchema = z.object({ channel: channelSlugSchema, deliverableId: z.uuid() });
export const dueDateParamsSchema = z.object({ channel: channelSlugSchema, deliverableId: z.uuid(), kind: z.enum(dueDateKinds) });

export const dealListQuerySchema = z.strictObject({
  sponsorId: z.uuid({ error: 'Not a sponsor.' }).optional(),
  episodeId: z.uuid({ error: 'Not an episode.' }).optional(),
  invoiceState: z.enum(invoiceStates, { error: 'Choose an invoice state.' }).optional(),
});
export type DealListQuery = z.infer<typeof dealListQuerySchema>;

export type SponsorDto = { id: string; name: string; contacts: SponsorContact[]; notes: string };
export type SponsorWithDealsDto = SponsorDto & { dealCount: number };

export type DueDateEventDto = { action: 'set' | 'done' | 'reopened'; dueOn: string | null; at: string; byName: string | null };
export type DueDateDto = {
  kind: DueDateKind;
  dueOn: string | null;
  overridden: boolean;
  doneAt: string | null;
  doneByName: string | null;
  history: DueDateEventDto[];
};

export type DeliverableDto = {
  id: string;
  dealId: string;
  episodeId: string;
  episodeTitle: string;
  segmentId: string | null;
  segmentTitle: string | null;
  kind: DeliverableKind;
  talkingPoints: ScriptDoc | null;
  mustSay: string[];
  disclosure: string;
  tracking: string;
  readMinSeconds: number | null;
  readMaxSeconds: number | null;
  placement: z.infer<typeof placementSchema> | null;
  ownerId: string | null;
  dueDates: DueDateDto[];
  checks: CheckResult[] | null;
  approval: ApprovalStateDto;
  approvalLinks: ApprovalLinkDto[];
};

/** The sponsor's approval: the script version approved, and whether the script moved on since. */
export type ApprovalStateDto = { approvedScriptVersion: number | null; approvedAt: string | null; changedSinceApproval: boolean };

export type DealDto = {
  id: string;
  sponsor: SponsorDto;
  title: string;
  feeMinor: number;
  currency: string;
  paymentTermsDays: number;
  invoiceState: InvoiceState;
  invoiceSentOn: string | null;
  paidOn: string | null;
  notes: string;
  deliverables: DeliverableDto[];
};

export type NextDueDto = { kind: DueDateKind; dueOn: string; deliverableId: string };
export type DealRowDto = {
  id: string;
  title: string;
  sponsorId: string;
  sponsorName: string;
  episodes: { id: string; title: string }[];
  feeMinor: number;
  currency: string;
  invoiceState: InvoiceState;
  invoiceSentOn: string | null;
  paidOn: string | null;
  nextDue: NextDueDto | null;
};

/** What an Editor may read of a deliverable: never a fee, never the deal's terms. */
export type EditorDeliverableDto = {
  id: string;
  sponsorName: string;
  episodeId: string;
  episodeTitle: string;
  segmentId: string | null;
  segmentTitle: string | null;
  kind: DeliverableKind;
  talkingPoints: ScriptDoc | null;
  disclosure: string;
  changedSinceApproval: boolean;
};
