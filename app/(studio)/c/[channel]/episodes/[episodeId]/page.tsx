import type { Metadata } from 'next';
import Link from 'next/link';
import { RunningOrderList } from '@/components/running-order/running-order-list';
import { StarterButton } from '@/components/episodes/starter-button';
import { EditStageSelect } from '@/components/handoff/edit-stage-select';
import { HandoffPanel } from '@/components/handoff/handoff-panel';
import { can } from '@/lib/auth/policy';
import { editStageLabels } from '@/lib/edit/stages';
import { listHandoffs } from '@/lib/handoffs/queries';
import { buttonClasses } from '@/components/ui/button';
import { requireMember } from '@/lib/auth/session';
import { stageLabels } from '@/lib/episodes/schemas';
import { orNotFound, uuidOr404 } from '@/lib/page-data';
import { formatDuration } from '@/lib/runtime';
import { getRunningOrder } from '@/lib/segments/queries';
import { Breadcrumb } from '@/components/ui/breadcrumb';
import { channelPage } from '@/lib/api/paths';

export const metadata: Metadata = { title: 'Running order' };

export default async function EpisodePage({ params }: { params: Promise<{ channel: string; episodeId: string }> }) {
  const { channel, episodeId } = await params;
  const member = await requireMember(channel);
  const runningOrder = await orNotFound(getRunningOrder(member, uuidOr404(episodeId)));
  const { episode } = runningOrder;
  const handoffs = can(member.role, 'handoff.read') ? await listHandoffs(member.channel.id, episode.id) : null;
  const base = channelPage(member.channel.slug, 'episodes');
  return (
    <>
      <Breadcrumb items={[{ href: base, label: 'Episodes' }]} />
      <header className="mb-6 flex flex-wrap items-start justify-between gap-3 border-b border-paper-edge pb-4">
        <div>
          <h1 className="text-2xl font-bold tracking-tight">{episode.title}</h1>
          {episode.premise ? <p className="mt-1 text-ink-soft">{episode.premise}</p> : null}
          <dl className="mt-2 flex flex-wrap gap-x-5 gap-y-1 text-sm">
            <div className="flex gap-1">
              <dt className="text-ink-faint">Stage</dt>
              <dd className="font-bold">{stageLabels[episode.stage]}</dd>
            </div>
            <div className="flex gap-1">
              <dt className="text-ink-faint">Edit</dt>
              <dd className="font-bold">{episode.editStage ? editStageLabels[episode.editStage] : 'not started'}</dd>
            </div>
            <div className="flex gap-1">
              <dt className="text-ink-faint">Target</dt>
              <dd className="font-mono">{episode.targetSeconds !== null ? formatDuration(episode.targetSeconds) : 'not set'}</dd>
            </div>
            <div className="flex gap-1">
              <dt className="text-ink-faint">Shoot</dt>
              <dd className="font-mono">{episode.shootDate ?? '—'}</dd>
            </div>
            <div className="flex gap-1">
              <dt className="text-ink-faint">Publish</dt>
              <dd className="font-mono">{episode.publishDate ?? '—'}</dd>
            </div>
          </dl>
        </div>
        <div className="flex flex-wrap gap-2">
          <Link href={`${base}/${episode.id}/cut-plan`} className={buttonClasses('secondary')}>
            Cut plan
          </Link>
          <Link href={`${base}/${episode.id}/shoot-sheet`} className={buttonClasses('secondary')}>
            Shoot-day sheet
          </Link>
          {runningOrder.canEdit ? (
            <Link href={`${base}/${episode.id}/edit`} className={buttonClasses('secondary')}>
              Edit episode
            </Link>
          ) : null}
        </div>
      </header>
      {handoffs ? (
        <div className="mb-6 grid gap-4 md:grid-cols-[1fr_16rem]">
          <HandoffPanel slug={member.channel.slug} episodeId={episode.id} initial={handoffs} canLock={can(member.role, 'handoff.lock')} />
          <div className="rounded-card border border-paper-edge bg-white/50 p-4 self-start">
            <EditStageSelect slug={member.channel.slug} episodeId={episode.id} initial={episode.editStage} canEdit={can(member.role, 'editNotes.edit')} />
          </div>
        </div>
      ) : null}
      {runningOrder.canEdit && runningOrder.segments.length === 0 ? (
        <div className="mb-6">
          <StarterButton channelSlug={member.channel.slug} episodeId={episode.id} />
        </div>
      ) : null}
      <RunningOrderList channelSlug={member.channel.slug} initialRunningOrder={runningOrder} />
    </>
  );
}
