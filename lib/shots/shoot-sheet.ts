import 'server-only';
import type { Membership } from '@/lib/channels/queries';
import type { EpisodeDto } from '@/lib/episodes/schemas';
import { listEpisodeParts } from '@/lib/parts/queries';
import type { PartDto } from '@/lib/parts/schemas';
import { getRunningOrder } from '@/lib/segments/queries';
import type { SegmentDto } from '@/lib/segments/schemas';
import { getCutSettings } from '@/lib/stock/queries';
import { listEpisodeShots } from './queries';
import { listEpisodeSafety } from '@/lib/safety/queries';
import type { SegmentSafetyDto } from '@/lib/safety/schemas';
import type { ShotDto } from './schemas';

export type ShootSheetSegment = {
  segment: SegmentDto;
  /** 1-based place in the running order. */
  position: number;
  shots: ShotDto[];
  /** Live shots left off the sheet because they are due on another day. */
  otherDayShots: number;
  parts: PartDto[];
  safety: SegmentSafetyDto;
};

export type ShootSheetDto = {
  episode: EpisodeDto;
  /** The day the sheet is for; null when neither the URL nor the episode names one, so every shot shows. */
  date: string | null;
  lengthUnit: 'in' | 'mm';
  segments: ShootSheetSegment[];
};

/** A shot belongs on the day's sheet when it is due that day or has no due date at all. */
export const dueOn = (shot: Pick<ShotDto, 'dueDate'>, date: string | null): boolean => date === null || shot.dueDate === null || shot.dueDate === date;

/**
 * Everything the crew needs on the floor for one episode and one day, in running order.
 * `date` undefined means "the episode's shoot date". Throws not_found for another channel's episode.
 */
export async function getShootSheet(member: Membership, episodeId: string, date?: string): Promise<ShootSheetDto> {
  const channelId = member.channel.id;
  // getRunningOrder checks the episode belongs to this channel before anything else is read.
  const runningOrder = await getRunningOrder(member, episodeId);
  const [parts, settings, allShots, safetyById] = await Promise.all([
    listEpisodeParts(channelId, episodeId),
    getCutSettings(channelId),
    listEpisodeShots(channelId, episodeId),
    listEpisodeSafety(channelId, episodeId),
  ]);
  const details = runningOrder.segments.map((segment, i) => {
    const safety = safetyById.get(segment.id);
    if (!safety) throw new Error(`segment ${segment.id} has no safety row`);
    return { segment, position: i + 1, shots: allShots.filter((s) => s.segmentId === segment.id), safety };
  });
  const day = date ?? runningOrder.episode.shootDate;
  return {
    episode: runningOrder.episode,
    date: day,
    lengthUnit: settings.lengthUnit,
    segments: details.map(({ shots, ...rest }) => {
      const today = shots.filter((s) => dueOn(s, day));
      return { ...rest, shots: today, otherDayShots: shots.length - today.length, parts: parts.filter((p) => p.segmentId === rest.segment.id) };
    }),
  };
}
