'use client';

import { useRouter } from 'next/navigation';
import { ScriptEditor } from '@/components/script/script-editor';
import type { ScriptDoc } from '@/lib/scripts/schemas';

/** The editor on the segment page: each accepted save refreshes the word count and forecast around it. */
export function LiveScriptEditor(props: { channelSlug: string; segmentId: string; initialDoc: ScriptDoc | null; initialVersion: number }) {
  const router = useRouter();
  return <ScriptEditor key={props.segmentId} {...props} onSaved={() => router.refresh()} />;
}
