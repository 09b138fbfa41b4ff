import { randomBytes } from 'node:crypto';
import { Readable } from 'node:stream';
import type { Upload } from '@tus/server';
import { findMembership } from '@/lib/channels/queries';
import { recordClipOnce } from '@/lib/clips/queries';
import { lockHandoff } from '@/lib/handoffs/queries';
import { hashesOf } from '@/storage/ingest';
import { clipStore } from '@/storage/tus-server';
import type { Crew } from './route-matrix';
import { makeShotEpisode } from './shot-fixtures';

export async function hostMember(c: Crew) {
  const m = await findMembership(c.channel.slug, c.host.id);
  if (!m) throw new Error('host is not a member');
  return m;
}

/** A clip whose bytes are really in the clip store (uploaded by the shop hand unless named). */
export async function storeClip(segmentId: string, shotId: string | null, uploadedBy: string, name = 'A001.mp4', bytes = randomBytes(3000)) {
  const uploadId = randomBytes(16).toString('hex');
  // Through the store's own tus side, so the bytes are where any store keeps them.
  const store = clipStore();
  await store.tus.create({ id: uploadId, size: bytes.length, offset: 0, metadata: {}, creation_date: new Date().toISOString() } as Upload);
  await store.tus.write(Readable.from([bytes]), uploadId, 0);
  // As ingest records a finished upload: SHA-256 and CRC-32 from one read of the bytes.
  const { sha256, crc32 } = await hashesOf(await store.read(uploadId));
  const { clipId } = await recordClipOnce({ uploadId, segmentId, shotId, uploadedBy, originalName: name, mimeType: 'video/mp4', sizeBytes: bytes.length, sha256, crc32 });
  return { clipId, uploadId, sha256 };
}

/** An episode with shots and one stored clip, locked as v1 by the host. */
export async function makeLockedEpisode(c: Crew) {
  const ep = await makeShotEpisode(c);
  const clip = await storeClip(ep.build.id, ep.shopShot.id, c.shopHand.id);
  const handoff = await lockHandoff(await hostMember(c), c.host, ep.episode.id, { note: 'First assembly' });
  return { ...ep, clip, handoff };
}
