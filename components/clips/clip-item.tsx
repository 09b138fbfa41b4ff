'use client';

import { useEffect, useId, useRef, useState } from 'react';
import { ClipNotes } from '@/components/handoff/clip-notes';
import { LocalTime } from '@/components/shop-board/dates';
import { Button, buttonClasses } from '@/components/ui/button';
import { formatBytes } from '@/lib/clips/names';
import type { ClipDto } from '@/lib/clips/schemas';
import Link from 'next/link';
import { channelPage } from '@/lib/api/paths';
import { ClipFiling, type Choice } from './clip-filing';
import { clipFileUrl, clipPosterUrl } from './use-clips';

type Props = {
  slug: string;
  clip: ClipDto;
  mayDelete: boolean;
  /** The edit notes on this clip are the viewer's to read (lib/edit/policy.ts). */
  mayReadNotes?: boolean;
  onDelete: (clip: ClipDto) => void;
  /** Which shot it was uploaded to, on the segment page. */
  shotLabel?: string | undefined;
  /** Inside a shop board card, whose own title is an h3. */
  nested?: boolean;
  /** On the segment page, for who may file this clip: the shots and segments it can be tied or moved to. */
  filing?: { shots: Choice[]; segments: Choice[]; onFiled: (text: string) => void } | undefined;
};

/** 3 -> "0:03", 3723 -> "1:02:03": the way an editor's timeline writes it. */
export function formatClipDuration(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  const pad = (n: number) => String(n).padStart(2, '0');
  return h > 0 ? `${h}:${pad(m)}:${pad(s % 60)}` : `${m}:${pad(s % 60)}`;
}

// 30000/1001 reads "29.97", 24000/1001 "23.976", 25 "25".
const formatFps = (fps: number) => `${Number(fps.toFixed(3))} fps`;

type Kind = 'video' | 'audio' | 'image' | 'other';
const kindOf = (mime: string): Kind => {
  const top = mime.split('/')[0];
  return top === 'video' || top === 'audio' || top === 'image' ? top : 'other';
};

async function copyText(text: string): Promise<boolean> {
  try {
    await navigator.clipboard.writeText(text);
    return true;
  } catch {
    // No Clipboard API outside a secure context (a phone on the shop's Wi-Fi by IP address).
    const area = document.createElement('textarea');
    area.value = text;
    area.setAttribute('readonly', '');
    area.style.position = 'fixed';
    area.style.opacity = '0';
    document.body.append(area);
    area.select();
    let ok = false;
    try {
      ok = document.execCommand('copy');
    } catch {
      ok = false;
    }
    area.remove();
    return ok;
  }
}

export function ClipItem({ slug, clip, mayDelete, mayReadNotes = false, onDelete, shotLabel, nested = false, filing }: Props) {
  const name = clip.originalName;
  const kind = kindOf(clip.mimeType);
  const [previewing, setPreviewing] = useState(false);
  const [copied, setCopied] = useState<'yes' | 'no' | null>(null);
  const [confirming, setConfirming] = useState(false);
  const previewId = useId();
  const deleteRef = useRef<HTMLButtonElement>(null);
  const noRef = useRef<HTMLButtonElement>(null);
  const Heading = nested ? 'h4' : 'h3';
  const sr = <span className="sr-only"> {name}</span>;

  useEffect(() => {
    if (copied !== 'yes') return;
    const t = setTimeout(() => setCopied(null), 4000);
    return () => clearTimeout(t);
  }, [copied]);

  useEffect(() => {
    if (confirming) noRef.current?.focus();
  }, [confirming]);

  function closeConfirm() {
    setConfirming(false);
    requestAnimationFrame(() => deleteRef.current?.focus());
  }

  return (
    <article id={`clip-${clip.id}`} aria-label={name} className="scroll-mt-4 space-y-3 rounded-card border border-paper-edge bg-white/80 p-3 shadow-card">
      <div className="flex gap-3">
        {clip.hasPoster ? (
          // eslint-disable-next-line @next/next/no-img-element -- a private, per-clip JPEG behind the session, not a static asset
          <img
            src={clipPosterUrl(slug, clip.id)}
            alt={`Poster frame of ${name}`}
            loading="lazy"
            className={`${nested ? 'w-20' : 'w-24 sm:w-40'} aspect-video shrink-0 self-start rounded-md bg-paper-deep object-cover`}
          />
        ) : (
          <Placeholder kind={kind} small={nested} />
        )}
        <div className="min-w-0 flex-1 space-y-1.5">
          <Heading className="font-bold leading-snug [overflow-wrap:anywhere]">{name}</Heading>
          {shotLabel ? <p className="break-words text-sm text-ink-soft">{shotLabel}</p> : null}
          {nested ? null : <MediaDetails clip={clip} />}
        </div>
      </div>
      {clip.duplicateOf ? (
        <p className="rounded-md border-l-4 border-attention bg-attention-soft px-3 py-2 text-sm text-attention-ink">
          <span className="font-bold">Same bytes as an earlier clip:</span>{' '}
          <Link href={`${channelPage(slug, 'episodes', clip.duplicateOf.episodeId, 'segments', clip.duplicateOf.segmentId)}#clip-${clip.duplicateOf.clipId}`} className="font-bold underline">
            {clip.duplicateOf.originalName}
          </Link>{' '}
          in {clip.duplicateOf.segmentTitle}. Delete this copy unless you need it twice.
        </p>
      ) : null}
      {/* A board column is too narrow to set the facts beside the poster. */}
      {nested ? <MediaDetails clip={clip} /> : null}

      <dl className="grid grid-cols-[auto_minmax(0,1fr)] items-baseline gap-x-3 gap-y-1 text-sm">
        <dt className="text-ink-faint">Uploaded by</dt>
        <dd className="break-words">{clip.uploaderName ?? 'A former crew member'}</dd>
        <dt className="text-ink-faint">Uploaded on</dt>
        <dd>
          <LocalTime iso={clip.createdAt} />
        </dd>
        <dt className="text-ink-faint">SHA-256</dt>
        <dd className="flex flex-wrap items-baseline gap-x-2">
          <code className="font-mono" title={clip.sha256}>
            {clip.sha256.slice(0, 12)}
          </code>
          <Button
            variant="quiet"
            className="-my-2.5 px-2 underline decoration-ink/30 underline-offset-2"
            onClick={() => void copyText(clip.sha256).then((ok) => setCopied(ok ? 'yes' : 'no'))}
          >
            Copy<span className="sr-only"> SHA-256 of {name}</span>
          </Button>
          <span role="status" className="text-ok empty:hidden">
            {copied === 'yes' ? 'Copied' : ''}
          </span>
        </dd>
      </dl>
      {copied === 'no' ? (
        <p className="text-sm">
          Could not copy. The full SHA-256:{' '}
          <input readOnly aria-label={`SHA-256 of ${name}`} value={clip.sha256} onFocus={(e) => e.currentTarget.select()} className="w-full rounded border border-ink/30 bg-white px-2 py-1 font-mono text-xs" />
        </p>
      ) : null}

      <div className="flex flex-wrap items-center gap-2">
        <Button variant="secondary" aria-expanded={previewing} aria-controls={previewId} onClick={() => setPreviewing((v) => !v)}>
          <svg aria-hidden="true" width="10" height="10" viewBox="0 0 10 10" className={`transition-transform ${previewing ? 'rotate-90' : ''}`}>
            <path d="M3 1.5L7 5 3 8.5" fill="none" stroke="currentColor" strokeWidth="1.6" />
          </svg>
          Preview{sr}
        </Button>
        <a href={`${clipFileUrl(slug, clip.id)}?download=1`} className={buttonClasses('secondary')}>
          Download{sr}
        </a>
        {mayDelete && !confirming ? (
          <button ref={deleteRef} type="button" className={buttonClasses('danger')} onClick={() => setConfirming(true)}>
            Delete{sr}
          </button>
        ) : null}
        {mayDelete && confirming ? (
          <div
            role="group"
            aria-label={`Delete ${name}?`}
            className="flex flex-wrap items-center gap-2 rounded-md bg-attention-soft px-2 py-1"
            onKeyDown={(e) => {
              if (e.key === 'Escape') closeConfirm();
            }}
          >
            <span className="text-sm font-bold text-attention-ink">Delete this clip?</span>
            <Button variant="danger" className="bg-white" onClick={() => onDelete(clip)}>
              Yes
            </Button>
            <button ref={noRef} type="button" className={buttonClasses('secondary')} onClick={closeConfirm}>
              No
            </button>
          </div>
        ) : null}
      </div>

      {filing ? <ClipFiling slug={slug} clip={clip} shots={filing.shots} segments={filing.segments} onFiled={filing.onFiled} /> : null}

      <div id={previewId} hidden={!previewing}>
        {previewing ? <Preview slug={slug} clip={clip} kind={kind} /> : null}
      </div>
      {mayReadNotes ? <ClipNotes slug={slug} clipId={clip.id} clipName={name} /> : null}
    </article>
  );
}

function MediaDetails({ clip }: { clip: ClipDto }) {
  const facts: [string, string][] = [['Size', formatBytes(clip.sizeBytes)]];
  if (clip.probeState === 'done') {
    if (clip.durationSeconds !== null) facts.push(['Duration', formatClipDuration(clip.durationSeconds)]);
    if (clip.width !== null && clip.height !== null) facts.push(['Resolution', `${clip.width}×${clip.height}`]);
    // ffprobe gives a still image a nominal 25 fps, which means nothing.
    if (clip.frameRate !== null && kindOf(clip.mimeType) !== 'image') facts.push(['Frame rate', formatFps(clip.frameRate)]);
    if (clip.codec) facts.push(['Codec', clip.codec]);
  }
  return (
    <>
      <dl className="flex flex-wrap gap-x-4 gap-y-0.5 text-sm">
        {facts.map(([label, value]) => (
          <div key={label} className="flex gap-1.5">
            <dt className="text-ink-faint">{label}</dt>
            <dd className="font-mono">{value}</dd>
          </div>
        ))}
      </dl>
      {clip.probeState === 'pending' ? (
        <p className="flex items-center gap-2 text-sm text-ink-soft">
          <span aria-hidden="true" className="inline-block h-3 w-3 animate-spin rounded-full border-2 border-ink-faint border-t-transparent" />
          Reading media details…
        </p>
      ) : clip.probeState !== 'done' ? (
        <p className="rounded-md bg-paper-deep px-2 py-1 text-sm text-ink-soft [overflow-wrap:anywhere]">Media details unavailable: {clip.probeNote ?? 'the file could not be read.'}</p>
      ) : null}
    </>
  );
}

function Preview({ slug, clip, kind }: { slug: string; clip: ClipDto; kind: Kind }) {
  const [unplayable, setUnplayable] = useState(false);
  const src = clipFileUrl(slug, clip.id);
  const label = `Preview of ${clip.originalName}`;
  if (unplayable || kind === 'other') {
    return <p className="rounded-md bg-paper-deep px-3 py-2 text-sm">This browser cannot play this file. Download it to watch it in your editing software.</p>;
  }
  if (kind === 'video') {
    return (
      <video
        controls
        preload="metadata"
        playsInline
        aria-label={label}
        src={src}
        poster={clip.hasPoster ? clipPosterUrl(slug, clip.id) : undefined}
        onError={() => setUnplayable(true)}
        className="max-h-[70vh] w-full max-w-2xl rounded-md bg-ink"
      />
    );
  }
  if (kind === 'audio') return <audio controls preload="metadata" aria-label={label} src={src} onError={() => setUnplayable(true)} className="w-full" />;
  // eslint-disable-next-line @next/next/no-img-element -- the original still, served with the session
  return <img src={src} alt={label} onError={() => setUnplayable(true)} className="max-h-[70vh] max-w-full rounded-md" />;
}

function Placeholder({ kind, small }: { kind: Kind; small: boolean }) {
  return (
    <div aria-hidden="true" className={`${small ? 'w-20' : 'w-24 sm:w-40'} flex aspect-video shrink-0 items-center justify-center self-start rounded-md bg-paper-deep text-ink-faint`}>
      <svg width="24" height="24" viewBox="0 0 24 24" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round">
        {kind === 'audio' ? (
          <path d="M9 18V6l10-2v12M9 18a3 3 0 1 1-3-3 3 3 0 0 1 3 3zm10-2a3 3 0 1 1-3-3 3 3 0 0 1 3 3z" />
        ) : kind === 'image' ? (
          <path d="M4 5h16v14H4zM4 16l5-5 4 4 2-2 5 5" />
        ) : (
          <path d="M3 6h13v12H3zM16 10l5-3v10l-5-3" />
        )}
      </svg>
    </div>
  );
}
