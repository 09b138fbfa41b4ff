import 'server-only';
import { can } from '@/lib/auth/policy';
import type { Membership } from '@/lib/channels/queries';
import { listVersionNotes } from '@/lib/edit/queries';
import { findEpisode } from '@/lib/episodes/queries';
import { clipsOfAll } from './assembly';
import { diffHandoffs, type HandoffDiff } from './diff';
import { findClipUploads, findHandoff, findTwoSnapshots, listHandoffs, recordHandoffRead } from './queries';

/**
 * The editor's view of one version: the snapshot, which clips are still stored, the notes, the
 * versions, and what changed since the version this person opened before (or since `since`).
 */
export async function getHandoffPage(member: Membership, episodeId: string, version: number, since?: number) {
  const [handoff, episode, versions] = await Promise.all([
    findHandoff(member.channel.id, episodeId, version),
    findEpisode(member.channel.id, episodeId),
    listHandoffs(member.channel.id, episodeId),
  ]);
  const [uploads, notes, previous] = await Promise.all([
    findClipUploads(member.channel.id, clipsOfAll(handoff.snapshot).map((c) => c.id)),
    listVersionNotes(member.channel.id, episodeId, version),
    recordHandoffRead(episodeId, member.userId, version),
  ]);
  const base = since !== undefined && since !== version ? since : previous !== null && previous < version ? previous : null;
  let changes: HandoffDiff | null = null;
  if (base !== null && versions.some((v) => v.version === base)) {
    const [a, b] = await findTwoSnapshots(member.channel.id, episodeId, base, version);
    changes = diffHandoffs(a, b);
  }
  return {
    handoff,
    episode,
    versions,
    notes,
    changes,
    storedClipIds: [...uploads.keys()],
    canWriteNotes: can(member.role, 'editNotes.edit'),
  };
}
export type HandoffPageData = Awaited<ReturnType<typeof getHandoffPage>>;
