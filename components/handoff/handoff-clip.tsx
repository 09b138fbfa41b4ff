'use client';

import { useId, useState } from 'react';
import { formatClipDuration } from '@/components/clips/clip-item';
import { clipFileUrl, clipPosterUrl } from '@/components/clips/use-clips';
import { Button, buttonClasses } from '@/components/ui/button';
import { formatBytes } from '@/lib/clips/names';
import type { SnapshotClip } from '@/lib/handoffs/snapshot';
import { usePlayerTime } from './player-time';

/** One clip of a version: poster, duration, preview in place, download. */
export function HandoffClip({ slug, clip, stored }: { slug: string; clip: SnapshotClip; stored: boolean }) {
  const [previewing, setPreviewing] = useState(false);
  const previewId = useId();
  const video = clip.mimeType.startsWith('video/');
  const { report } = usePlayerTime();
  const reportTime = (e: React.SyntheticEvent<HTMLVideoElement>) => report({ clipId: clip.id, clipName: clip.name, seconds: e.currentTarget.currentTime });
  return (
    <li className="flex flex-wrap items-start gap-3 rounded-md border border-paper-edge bg-white p-2">
      {clip.hasPoster && stored ? (
        // eslint-disable-next-line @next/next/no-img-element -- a private, authenticated poster; next/image would proxy it
        <img src={clipPosterUrl(slug, clip.id)} alt="" width={96} height={54} className="h-[54px] w-24 rounded bg-paper-deep object-cover print:hidden" />
      ) : (
        <div aria-hidden="true" className="h-[54px] w-24 rounded bg-paper-deep print:hidden" />
      )}
      <div className="min-w-0 flex-1">
        <p className="break-all font-bold">{clip.name}</p>
        <p className="text-sm text-ink-soft">
          <span className="font-mono">{clip.durationSeconds !== null ? formatClipDuration(clip.durationSeconds) : 'length unknown'}</span>
          {' · '}
          {formatBytes(clip.sizeBytes)}
          {clip.frameRate ? ` · ${Number(clip.frameRate.toFixed(3))} fps` : ''}
        </p>
        <p className="font-mono text-xs break-all text-ink-faint">SHA-256 {clip.sha256}</p>
        {!stored ? <p className="text-sm font-bold text-attention-ink">This clip was deleted after the lock; its bytes are gone.</p> : null}
      </div>
      {stored ? (
        <div className="flex flex-wrap gap-2 print:hidden">
          {video ? (
            <Button variant="secondary" aria-expanded={previewing} aria-controls={previewId} onClick={() => setPreviewing((p) => !p)}>
              {previewing ? 'Hide preview' : 'Preview'}
              <span className="sr-only"> {clip.name}</span>
            </Button>
          ) : null}
          <a href={`${clipFileUrl(slug, clip.id)}?download=1`} className={buttonClasses('secondary')} download>
            Download<span className="sr-only"> {clip.name}</span>
          </a>
        </div>
      ) : null}
      {previewing ? (
        <div id={previewId} className="basis-full">
          <video
            src={clipFileUrl(slug, clip.id)}
            controls
            preload="metadata"
            className="max-h-80 w-full rounded bg-black"
            aria-label={`Preview of ${clip.name}`}
            onLoadedMetadata={reportTime}
            onTimeUpdate={reportTime}
            onSeeked={reportTime}
            onPause={reportTime}
          />
        </div>
      ) : null}
    </li>
  );
}
