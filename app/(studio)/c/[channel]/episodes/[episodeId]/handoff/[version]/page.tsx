import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { HandoffView } from '@/components/handoff/handoff-view';
import { Breadcrumb } from '@/components/ui/breadcrumb';
import { pageAccess } from '@/lib/auth/page-access';
import { requireMember } from '@/lib/auth/session';
import { getHandoffPage } from '@/lib/handoffs/page-data';
import { orNotFound, uuidOr404 } from '@/lib/page-data';

export const metadata: Metadata = { title: 'Handoff' };

type Props = { params: Promise<{ channel: string; episodeId: string; version: string }>; searchParams: Promise<{ since?: string | string[] }> };

const versionOf = (raw: string | undefined): number | undefined => (raw && /^\d{1,6}$/.test(raw) && Number(raw) > 0 ? Number(raw) : undefined);

export default async function HandoffPage({ params, searchParams }: Props) {
  const { channel, episodeId, version } = await params;
  const member = await requireMember(channel, pageAccess.handoff.capability);
  const v = versionOf(version);
  if (v === undefined) notFound();
  const since = (await searchParams).since;
  const data = await orNotFound(getHandoffPage(member, uuidOr404(episodeId), v, versionOf(Array.isArray(since) ? since[0] : since)));
  const base = `/c/${member.channel.slug}/episodes`;
  return (
    <>
      <div className="print:hidden">
        <Breadcrumb
          items={[
            { href: base, label: 'Episodes' },
            { href: `${base}/${episodeId}`, label: data.episode.title },
          ]}
        />
      </div>
      <HandoffView slug={member.channel.slug} data={data} />
    </>
  );
}
