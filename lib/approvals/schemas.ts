import { z } from 'zod';
import { channelSlugSchema } from '@/lib/channels/schemas';
import type { ScriptDoc } from '@/lib/scripts/schemas';
import type { DeliverableKind } from '@/lib/sponsors/schemas';
import { emailSchema } from '@/lib/users/schemas';

export const APPROVAL_TTL_DAYS = 14;

export const sendApprovalSchema = z.strictObject({ contactEmail: emailSchema });

export const approvalDecisions = ['approved', 'changes_requested'] as const;
export type ApprovalDecision = (typeof approvalDecisions)[number];

export const decideApprovalSchema = z
  .strictObject({
    decision: z.enum(approvalDecisions, { error: 'Choose Approve or Request changes.' }),
    comment: z.string({ error: 'Write a comment.' }).trim().max(2000, 'Keep the comment under 2,000 characters.').default(''),
    // The version the sponsor read; a script saved since then must be read again before deciding.
    scriptVersion: z.number({ error: 'Reload the page.' }).int().min(0),
  })
  .refine((v) => v.decision === 'approved' || v.comment.length > 0, { message: 'Say what should change.', path: ['comment'] });
export type DecideApprovalInput = z.infer<typeof decideApprovalSchema>;

export const approvalTokenParamsSchema = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/) });
export const approvalLinkParamsSchema = z.object({ channel: channelSlugSchema, linkId: z.uuid() });

export type ApprovalLinkDto = {
  id: string;
  contactEmail: string;
  createdAt: string;
  expiresAt: string;
  revoked: boolean;
  expired: boolean;
  decision: ApprovalDecision | null;
  comment: string | null;
  scriptVersion: number | null;
  decidedAt: string | null;
};

export type ApprovalStatus = 'open' | 'unknown' | 'revoked' | 'expired' | 'decided';

/** What the sponsor's page shows: the read as it is now, nothing else of the channel. */
export type ApprovalViewDto = {
  status: ApprovalStatus;
  channelName: string;
  sponsorName: string;
  kind: DeliverableKind;
  episodeTitle: string;
  segmentTitle: string | null;
  script: ScriptDoc | null;
  scriptVersion: number;
  talkingPoints: ScriptDoc | null;
  disclosure: string;
  mustSay: string[];
  expiresAt: string;
  decision: ApprovalDecision | null;
};
