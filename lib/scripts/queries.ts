import 'server-only';
import { db } from '@/db/client';
import { conflict, invalidInput, notFound } from '@/lib/errors';
import { scriptStats } from '@/lib/scripts/plain-text';
import { parseScriptDoc, type SavedScriptDto, type ScriptDoc, type ScriptDto } from '@/lib/scripts/schemas';

type ScriptRow = { script: ScriptDoc | null; script_version: number; word_count: number; updated_at: Date };

export async function getScript(channelId: string, segmentId: string): Promise<ScriptDto> {
  const row: ScriptRow | undefined = await db('segments as s')
    .join('episodes as e', 'e.id', 's.episode_id')
    .where({ 's.id': segmentId, 'e.channel_id': channelId })
    .first('s.script', 's.script_version', 's.word_count', 's.updated_at');
  if (!row) throw notFound('That segment');
  return { doc: row.script, version: row.script_version, wordCount: row.word_count, updatedAt: row.updated_at.toISOString() };
}

/**
 * Saves only on top of the version the writer started from; a stale save is 409 and changes nothing,
 * so the writer's editor keeps its text and can reload or overwrite on purpose.
 */
export async function saveScript(channelId: string, segmentId: string, doc: unknown, baseVersion: number): Promise<SavedScriptDto> {
  const parsed = parseScriptDoc(doc);
  if (!parsed.ok) throw invalidInput({ doc: parsed.message }, 'The script has content the editor does not allow.');
  const { text, wordCount } = scriptStats(parsed.doc);
  await getScript(channelId, segmentId);
  const [row] = await db('segments')
    .where({ id: segmentId, script_version: baseVersion })
    .update({
      script: JSON.stringify(parsed.doc),
      script_text: text,
      word_count: wordCount,
      script_version: db.raw('script_version + 1'),
      updated_at: db.fn.now(),
    })
    .returning<{ script_version: number; word_count: number; updated_at: Date }[]>(['script_version', 'word_count', 'updated_at']);
  if (row) return { version: row.script_version, wordCount: row.word_count, updatedAt: row.updated_at.toISOString() };
  throw conflict('Someone else changed this script since you opened it.');
}
