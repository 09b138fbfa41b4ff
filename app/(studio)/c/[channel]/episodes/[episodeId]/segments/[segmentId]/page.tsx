import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { ClipList } from '@/components/clips/clip-list';
import { UploadPanel } from '@/components/clips/upload-panel';
import { ScriptView } from '@/components/script/script-view';
import { ActionTimeForm } from '@/components/segments/action-time-form';
import { PartsEditor } from '@/components/parts/parts-editor';
import { LiveScriptEditor } from '@/components/segments/live-script-editor';
import { SafetyPanel } from '@/components/shots/safety-panel';
import { ShotList } from '@/components/shots/shot-list';
import { can } from '@/lib/auth/policy';
import { requireMember } from '@/lib/auth/session';
import { listSegmentClips } from '@/lib/clips/queries';
import { planSegment } from '@/lib/cut-plans/queries';
import { findEpisode } from '@/lib/episodes/queries';
import { listCrew } from '@/lib/crew/queries';
import { listSegmentParts } from '@/lib/parts/queries';
import { orNotFound, uuidOr404 } from '@/lib/page-data';
import { formatDuration, spokenSeconds } from '@/lib/runtime';
import { findSegment, getRunningOrder } from '@/lib/segments/queries';
import { kindLabels } from '@/lib/segments/schemas';
import { getScript } from '@/lib/scripts/queries';
import { listSegmentShots } from '@/lib/shots/queries';
import { getSegmentSafety } from '@/lib/safety/queries';
import { listStock } from '@/lib/stock/queries';
import { Breadcrumb } from '@/components/ui/breadcrumb';
import { channelPage } from '@/lib/api/paths';
import { Stat } from '@/components/ui/stat';
import { SegmentSponsorChecks } from '@/components/sponsors/segment-sponsor-checks';
import { listSegmentDeliverables } from '@/lib/sponsors/deliverable-queries';

export const metadata: Metadata = { title: 'Segment' };

type Params = { channel: string; episodeId: string; segmentId: string };

export default async function SegmentPage({ params }: { params: Promise<Params> }) {
  const { channel, episodeId, segmentId } = await params;
  const member = await requireMember(channel);
  const [episode, segment, script, shots, safety, crew, clips, order] = await orNotFound(
    Promise.all([
      findEpisode(member.channel.id, uuidOr404(episodeId)),
      findSegment(member.channel.id, uuidOr404(segmentId)),
      getScript(member.channel.id, segmentId),
      listSegmentShots(member.channel.id, segmentId),
      getSegmentSafety(member.channel.id, segmentId),
      listCrew(member.channel.id),
      listSegmentClips(member.channel.id, segmentId),
      // The segments a clip can be moved to (issue 15).
      getRunningOrder(member, uuidOr404(episodeId)),
    ]),
  );
  if (segment.episodeId !== episode.id) notFound();
  const build = segment.kind === 'build' && can(member.role, 'cutlist.read');
  const cut = build
    ? await Promise.all([listSegmentParts(member.channel.id, segment.id), listStock(member.channel.id), planSegment(member.channel.id, segment.id)])
    : null;
  // Each script save refreshes this page, so the sponsor checks follow the script as it is written.
  const sponsorReads = can(member.role, 'sponsors.readDisclosure') ? await listSegmentDeliverables(member.channel.id, segment.id, member.channel.speakingRateWpm) : [];
  const canWrite = can(member.role, 'scripts.write');
  // Only a Host or a Shop hand may hold a shot.
  const assignable = crew.filter((c) => c.role === 'host' || c.role === 'shop_hand').map((c) => ({ userId: c.userId, name: c.name }));
  const spoken = spokenSeconds(segment.wordCount, member.channel.speakingRateWpm);
  const base = channelPage(member.channel.slug, 'episodes', episode.id);
  return (
    <>
      <Breadcrumb items={[{ href: channelPage(member.channel.slug, 'episodes'), label: 'Episodes' }, { href: base, label: episode.title }]} />
      <header className="mb-6 border-b border-paper-edge pb-4">
        <p className="text-sm font-bold uppercase tracking-wide text-ink-faint">
          {kindLabels[segment.kind]}
          {segment.level ? ` · Level ${segment.level} · ${episode.levelLabels[segment.level - 1]}` : ''}
        </p>
        <h1 className="text-2xl font-bold tracking-tight">{segment.title}</h1>
        <dl className="mt-3 grid max-w-xl grid-cols-2 gap-3 text-sm sm:grid-cols-4">
          <Stat label="Words" value={String(segment.wordCount)} />
          <Stat label="Spoken" value={formatDuration(spoken)} />
          <Stat label="Action" value={formatDuration(segment.actionSeconds)} />
          <Stat label="Total" value={formatDuration(spoken + segment.actionSeconds)} />
        </dl>
        <p className="mt-2 text-xs text-ink-faint">Spoken time at {member.channel.speakingRateWpm} words per minute.</p>
      </header>
      {can(member.role, 'episodes.edit') ? (
        <section aria-label="Action time" className="mb-6">
          <ActionTimeForm channelSlug={member.channel.slug} segment={segment} />
        </section>
      ) : null}
      <section aria-labelledby="script-heading">
        <h2 id="script-heading" className="mb-3 text-lg font-bold">
          Script
        </h2>
        {canWrite ? (
          <LiveScriptEditor channelSlug={member.channel.slug} segmentId={segment.id} initialDoc={script.doc} initialVersion={script.version} />
        ) : (
          <div className="rounded-card border border-paper-edge bg-white/70 p-5">
            <p className="mb-3 text-xs text-ink-faint">Read-only: only a Host writes scripts.</p>
            <ScriptView doc={script.doc} />
          </div>
        )}
      </section>
      {sponsorReads.length > 0 ? <SegmentSponsorChecks deliverables={sponsorReads} channelSlug={member.channel.slug} canManage={can(member.role, 'sponsors.manage')} /> : null}
      <section aria-labelledby="safety-heading" className="mt-8">
        <h2 id="safety-heading" className="mb-3 text-lg font-bold">
          Shop safety
        </h2>
        <SafetyPanel
          channelSlug={member.channel.slug}
          segmentId={segment.id}
          initialSafety={safety}
          canEditTools={can(member.role, 'episodes.edit')}
          canReview={can(member.role, 'safety.review')}
        />
      </section>
      <section aria-labelledby="shots-heading" className="mt-8">
        <ShotList
          channelSlug={member.channel.slug}
          segmentId={segment.id}
          initialShots={shots}
          crew={assignable}
        />
      </section>
      <section aria-labelledby="clips-heading" className="mt-8">
        <h2 id="clips-heading" className="mb-3 text-lg font-bold">
          Clips
        </h2>
        <div className="space-y-4">
          {can(member.role, 'clips.upload') ? <UploadPanel slug={member.channel.slug} segmentId={segment.id} /> : null}
          <ClipList
            slug={member.channel.slug}
            segmentId={segment.id}
            initialClips={clips}
            initialShots={shots}
            segments={order.segments.map((s, i) => ({ id: s.id, label: `${i + 1}. ${s.title}` }))}
          />
        </div>
      </section>
      {cut ? (
        <section aria-labelledby="parts-heading" className="mt-8">
          <h2 id="parts-heading" className="mb-3 text-lg font-bold">
            Parts list
          </h2>
          <PartsEditor
            channelSlug={member.channel.slug}
            segmentId={segment.id}
            episodeId={episode.id}
            canEdit={can(member.role, 'cutlist.edit')}
            initialParts={cut[0]}
            stock={cut[1]}
            initialPlan={cut[2]}
          />
        </section>
      ) : null}
    </>
  );
}
