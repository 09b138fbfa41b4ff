import 'server-only';
import type { Upload } from '@tus/server';
import { NextRequest } from 'next/server';
import { refuseCrossSite } from '@/lib/api/origin';
import { can } from '@/lib/auth/policy';
import { getUserFromRequest } from '@/lib/auth/session';
import { displayName } from '@/lib/clips/names';
import { DELETE_OWN_ONLY, mayDeleteClip } from '@/lib/clips/policy';
import { findUploadTarget, roleInChannel } from '@/lib/clips/queries';
import { appUrl, config } from '@/lib/config';
import { isAcceptedType, uploadMetadataSchema } from '@/lib/clips/schemas';
import type { UserDto } from '@/lib/users/schemas';
import { isUploadId, type ClipStore } from './clip-store';
import { ingestUpload } from './ingest';
import { tusError } from './tus-errors';

async function authenticate(req: Request): Promise<UserDto> {
  const user = await getUserFromRequest(new NextRequest(req.url, { headers: req.headers }));
  if (!user) throw tusError(401, 'Sign in to upload clips.');
  return user;
}

const notYours = () => tusError(404, 'No such upload.');

/** Policy for every tus request: who may create, continue, read back or cancel an upload. */
export function uploadHooks(store: ClipStore) {
  return {
    async onIncomingRequest(req: Request, uploadId: string): Promise<void> {
      // The same cross-site guard as lib/api/handler.ts: tus POST, PATCH and DELETE change state.
      const crossSite = refuseCrossSite(req, appUrl());
      if (crossSite) throw tusError(403, crossSite.message);
      const user = await authenticate(req);
      if (req.method === 'POST' || !uploadId) return;
      // Only who and where: the handler reads the upload's offset again under its lock.
      const found = isUploadId(uploadId) ? await store.uploadMetadata(uploadId) : null;
      const meta = found ?? {};
      // Someone else's upload does not exist as far as this person can tell.
      if (!found || meta.uploaderId !== user.id || !meta.channelId) throw notYours();
      const role = await roleInChannel(user.id, meta.channelId);
      if (!role) throw notYours();
      if (!can(role, 'clips.upload')) throw tusError(403, 'Your role on this channel does not allow uploading clips.');
      // Cancelling an upload deletes its bytes: the same rule as deleting a recorded clip.
      if (req.method === 'DELETE' && !mayDeleteClip(role, meta.uploaderId, user.id)) throw tusError(403, DELETE_OWN_ONLY);
    },

    async onUploadCreate(req: Request, upload: Upload): Promise<{ metadata: Record<string, string> }> {
      const user = await authenticate(req);
      const parsed = uploadMetadataSchema.safeParse(upload.metadata ?? {});
      if (!parsed.success) throw tusError(400, parsed.error.issues[0]?.message ?? 'The upload metadata is not valid.');
      const { segmentId, shotId, filename, filetype } = parsed.data;
      const target = await findUploadTarget(user.id, segmentId, shotId);
      if (!target?.role) throw tusError(404, 'That segment was not found.');
      if (!can(target.role, 'clips.upload')) throw tusError(403, 'Your role on this channel does not allow uploading clips.');
      if (!target.shotInSegment) throw tusError(400, 'That shot is not in this segment.');
      if (!isAcceptedType(filetype)) throw tusError(415, `Upload video, audio or still images; “${filetype.slice(0, 60)}” is not one of them.`);
      // The stored metadata is rebuilt here, so a client cannot name another uploader or channel.
      return {
        metadata: {
          segmentId,
          ...(shotId ? { shotId } : {}),
          filename: displayName(filename),
          filetype: filetype.toLowerCase(),
          uploaderId: user.id,
          channelId: target.channelId,
        },
      };
    },

    async onUploadFinish(_req: Request, upload: Upload): Promise<Record<string, never>> {
      // Test hook (tests/integration/uploads.test.ts): die after the last byte, before the clip row, as a crash would.
      if (config().KERFLINE_TEST_CRASH_BEFORE_CLIP_ROW) process.exit(137);
      await ingestUpload(store, upload);
      return {};
    },
  };
}
