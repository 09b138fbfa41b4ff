import { saveScript } from '@/lib/scripts/queries';
import { createDeliverable } from '@/lib/sponsors/deliverable-queries';
import { createDeal, createSponsor } from '@/lib/sponsors/queries';
import { createDeliverableSchema } from '@/lib/sponsors/schemas';
import { makeOutlinedEpisode } from './episode-fixtures';
import type { Crew } from './route-matrix';

/** Paragraph doc of plain text, as the script editor saves it. */
export const docOf = (text: string) => ({ type: 'doc' as const, content: [{ type: 'paragraph' as const, content: [{ type: 'text' as const, text }] }] });

/** A sponsor, a deal and a read on the outlined episode's sponsor read segment. */
export async function makeDeal(c: Crew, sponsorName = 'Bramblewick Abrasives') {
  const { episode, segments } = await makeOutlinedEpisode(c);
  const read = segments.find((s) => s.kind === 'sponsor_read');
  if (!read) throw new Error('no sponsor read in the starter outline');
  const sponsor = await createSponsor(c.channel.id, { name: sponsorName, contacts: [{ name: 'Ines Okafor', email: 'ines@bramblewick.test' }], notes: '' });
  const deal = await createDeal(c.channel.id, {
    sponsorId: sponsor.id,
    title: 'Spring sanding read',
    feeMinor: 250_000,
    currency: 'USD',
    paymentTermsDays: 30,
    invoiceState: 'not_sent',
    invoiceSentOn: null,
    paidOn: null,
    notes: '',
  });
  const deliverable = await createDeliverable(
    c.channel.id,
    deal.id,
    createDeliverableSchema.parse({
      episodeId: episode.id,
      segmentId: read.id,
      kind: 'segment_read',
      talkingPoints: docOf('Mention the hook-and-loop discs.'),
      mustSay: ['code KERF10'],
      disclosure: 'This video is sponsored by Bramblewick',
      readMinSeconds: 5,
      readMaxSeconds: 90,
      placement: { kind: 'within_percent', percent: 50 },
      dueDates: { script_due: '2027-03-01', go_live: '2027-03-20' },
    }),
    c.host.id,
  );
  return { episode, segments, read, sponsor, deal, deliverable };
}

export async function writeScript(c: Crew, segmentId: string, text: string, baseVersion: number) {
  return saveScript(c.channel.id, segmentId, docOf(text), baseVersion);
}
