import 'server-only';
import { db } from '@/db/client';
import { can } from '@/lib/auth/policy';
import type { Membership } from '@/lib/channels/queries';
import { listEpisodes } from '@/lib/episodes/queries';
import type { EpisodeSummaryDto } from '@/lib/episodes/schemas';
import { listPendingSafety } from '@/lib/safety/queries';
import type { PendingSafetyDto } from '@/lib/safety/schemas';
import { dueStatus, type DueStatus } from '@/lib/shots/due';
import { listMyShots } from '@/lib/shots/queries';
import type { BoardShotDto } from '@/lib/shots/schemas';
import { addDays } from '@/lib/sponsors/dates';
import { listChangedSinceApproval } from '@/lib/sponsors/deliverable-queries';
import { listOpenDueDates, type UpcomingDueDto } from '@/lib/sponsors/due-date-queries';
import type { EditorDeliverableDto } from '@/lib/sponsors/schemas';

/** The days ahead the dashboard looks for due dates. */
export const DASHBOARD_DAYS_AHEAD = 14;

export type DashboardEpisode = EpisodeSummaryDto & { shotsTotal: number; shotsCaptured: number };
export type DashboardDto = {
  today: string;
  /** Sponsor due dates, overdue or within the next 14 days; only for who manages sponsors. */
  dueDates: UpcomingDueDto[] | null;
  /** My shots due today, tomorrow or overdue; only for who captures shots. */
  myShots: (BoardShotDto & { due: Exclude<DueStatus, null> })[] | null;
  /** Episodes between Outline and Edit, with forecast and shot progress. */
  inProgress: DashboardEpisode[];
  /** Sponsor reads whose script changed after the sponsor approved it; for who reads sponsor reads. */
  changedSinceApproval: (EditorDeliverableDto & { dealId: string })[] | null;
  /** Segments waiting for a safety review whose shoot is today or ahead (or not dated), soonest first; for who captures shots. */
  safetyReviews: PendingSafetyDto[] | null;
  /** For the Editor: the episodes at the Edit stage. */
  readyForEdit: DashboardEpisode[] | null;
};

const inProgressStages = new Set(['outline', 'shoot', 'edit']);

/** "What needs me": one read per section, filtered by the member's role. */
export async function getDashboard(member: Membership, today: string): Promise<DashboardDto> {
  const channelId = member.channel.id;
  const [episodes, progress, dueDates, shots, changed, pendingSafety] = await Promise.all([
    listEpisodes(channelId, member.channel.speakingRateWpm, { archived: false }),
    shotProgressByEpisode(channelId),
    can(member.role, 'sponsors.manage') ? listOpenDueDates(channelId, addDays(today, DASHBOARD_DAYS_AHEAD)) : Promise.resolve(null),
    can(member.role, 'shots.changeState') ? listMyShots(channelId, member.userId) : Promise.resolve(null),
    can(member.role, 'sponsors.readDisclosure') ? listChangedSinceApproval(channelId) : Promise.resolve(null),
    can(member.role, 'shots.changeState') ? listPendingSafety(channelId) : Promise.resolve(null),
  ]);
  const withShots = episodes.map((e) => ({ ...e, shotsTotal: progress.get(e.id)?.total ?? 0, shotsCaptured: progress.get(e.id)?.captured ?? 0 }));
  const myShots = shots
    ? shots.flatMap((s) => {
        const due = dueStatus(s.dueDate, s.state, today);
        return due ? [{ ...s, due }] : [];
      })
    : null;
  return {
    today,
    dueDates,
    myShots,
    changedSinceApproval: changed,
    safetyReviews: pendingSafety ? upcomingReviews(pendingSafety, today) : null,
    inProgress: withShots.filter((e) => inProgressStages.has(e.stage)),
    readyForEdit: member.role === 'editor' ? withShots.filter((e) => e.stage === 'edit') : null,
  };
}

/** Before the shoot is when a review helps: drop shoots already past, soonest first, undated last. */
function upcomingReviews(pending: PendingSafetyDto[], today: string): PendingSafetyDto[] {
  return pending
    .filter((p) => p.shootDate === null || p.shootDate >= today)
    .sort((a, b) => (a.shootDate ?? '9999-12-31').localeCompare(b.shootDate ?? '9999-12-31'));
}

async function shotProgressByEpisode(channelId: string): Promise<Map<string, { total: number; captured: number }>> {
  const rows: { episode_id: string; total: number; captured: number }[] = await db('shots as sh')
    .join('segments as s', 's.id', 'sh.segment_id')
    .join('episodes as e', 'e.id', 's.episode_id')
    .where('e.channel_id', channelId)
    .whereNull('sh.deleted_at')
    .groupBy('s.episode_id')
    .select('s.episode_id', db.raw('count(*)::int as total'), db.raw(`count(*) filter (where sh.state = 'captured')::int as captured`));
  return new Map(rows.map((r) => [r.episode_id, { total: r.total, captured: r.captured }]));
}
