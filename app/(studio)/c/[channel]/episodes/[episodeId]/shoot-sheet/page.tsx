import type { Metadata } from 'next';
import { ShootSheet } from '@/components/shoot-sheet/shoot-sheet';
import { ShootSheetHeader } from '@/components/shoot-sheet/shoot-sheet-header';
import { Alert } from '@/components/ui/alert';
import { requireMember } from '@/lib/auth/session';
import { findEpisode } from '@/lib/episodes/queries';
import { dateSchema } from '@/lib/episodes/schemas';
import { orNotFound, uuidOr404 } from '@/lib/page-data';
import { getShootSheet } from '@/lib/shots/shoot-sheet';

export const metadata: Metadata = { title: 'Shoot-day sheet' };

type Props = {
  params: Promise<{ channel: string; episodeId: string }>;
  searchParams: Promise<{ date?: string | string[] }>;
};

export default async function ShootSheetPage({ params, searchParams }: Props) {
  const { channel, episodeId } = await params;
  const member = await requireMember(channel);
  const id = uuidOr404(episodeId);
  const query = (await searchParams).date;
  // An emptied date field submits "date=": that means the episode's own shoot date.
  const raw = (Array.isArray(query) ? query[0] : query)?.trim() || undefined;
  const parsed = raw === undefined ? undefined : dateSchema.safeParse(raw);
  const header = { channelSlug: member.channel.slug, channelName: member.channel.name };

  if (raw !== undefined && parsed?.success === false) {
    const episode = await orNotFound(findEpisode(member.channel.id, id));
    const reason = parsed.error.issues[0]?.message ?? 'Use a date like 2027-03-14.';
    return (
      <>
        <ShootSheetHeader {...header} episode={episode} date={null} dateError={reason} />
        <Alert tone="attention" title={`“${raw.slice(0, 40)}” is not a day Kerfline can show.`}>
          {reason} Pick a day in the Shoot date field and press Show.
        </Alert>
      </>
    );
  }

  const sheet = await orNotFound(getShootSheet(member, id, parsed?.data));
  return (
    <>
      <ShootSheetHeader {...header} episode={sheet.episode} date={sheet.date} />
      <ShootSheet sheet={sheet} channelSlug={member.channel.slug} />
    </>
  );
}
