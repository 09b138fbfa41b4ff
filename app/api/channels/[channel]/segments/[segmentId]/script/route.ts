import { route } from '@/lib/api/handler';
import { getScript, saveScript } from '@/lib/scripts/queries';
import { segmentParamsSchema } from '@/lib/segments/schemas';
import { saveScriptSchema } from '@/lib/scripts/schemas';

export const GET = route({ params: segmentParamsSchema, channel: 'scripts.read' }, async ({ member, params }) => ({
  script: await getScript(member.channel.id, params.segmentId),
}));

// A long script is a few hundred KB of Tiptap JSON at most; 1 MB leaves room without inviting abuse.
export const PUT = route(
  { params: segmentParamsSchema, body: saveScriptSchema, channel: 'scripts.write', maxBodyBytes: 1024 * 1024 },
  async ({ member, params, body }) => ({ script: await saveScript(member.channel.id, params.segmentId, body.doc, body.baseVersion) }),
);
