'use client';

import { useEffect, useRef, useState, type DragEvent } from 'react';
import { Button, buttonClasses } from '@/components/ui/button';
import { formatBytes } from '@/lib/clips/names';
import { useTusUploads, type UploadRow } from './use-tus-uploads';

type Props = {
  slug: string;
  segmentId: string;
  shotId?: string | null;
  /** Inside a shop board card: a full-width button and a shorter hint. */
  compact?: boolean;
};

const MiB = 1024 * 1024;

function timeLeft(seconds: number): string {
  const s = Math.max(1, Math.ceil(seconds));
  if (s < 60) return `${s} s left`;
  if (s < 3600) return `${Math.floor(s / 60)} min ${s % 60} s left`;
  return `${Math.floor(s / 3600)} h ${Math.floor((s % 3600) / 60)} min left`;
}

function stateText(row: UploadRow): string {
  switch (row.state) {
    case 'waiting':
      return 'Waiting';
    case 'starting':
      return 'Uploading';
    case 'uploading':
      // Every byte is there; the server is checking the file before it becomes a clip.
      return row.sent >= row.size && row.size > 0 ? 'Finishing…' : 'Uploading';
    case 'paused':
      return 'Paused';
    case 'reconnecting':
      return 'Reconnecting…';
    case 'done':
      return 'Uploaded';
    case 'failed':
      return `Failed: ${row.error ?? 'the upload stopped.'}`;
  }
}

const barTone = (row: UploadRow) =>
  row.state === 'done' ? 'bg-ok' : row.state === 'failed' ? 'bg-attention' : row.state === 'paused' ? 'bg-ink-faint' : 'bg-blueprint';

/** Drop zone, file picker and one row per file with its progress and controls. */
export function UploadPanel({ slug, segmentId, shotId = null, compact = false }: Props) {
  const uploads = useTusUploads({ slug, segmentId, shotId });
  const inputRef = useRef<HTMLInputElement>(null);
  const dragDepth = useRef(0);
  const [over, setOver] = useState(false);
  const [notice, setNotice] = useState('');

  function take(files: File[]) {
    if (files.length === 0) return;
    const { skipped } = uploads.add(files);
    setNotice(skipped.length > 0 ? `Already in the list: ${skipped.join(', ')}.` : '');
  }

  // Files picked before React hydrated fired no onChange; they are still on the input, so take them now.
  useEffect(() => {
    const input = inputRef.current;
    if (!input?.files?.length) return;
    take(Array.from(input.files));
    input.value = '';
    // Once, on mount: later picks go through onChange.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  const hasFiles = (e: DragEvent) => Array.from(e.dataTransfer.types).includes('Files');

  function onDrop(e: DragEvent) {
    if (!hasFiles(e)) return;
    e.preventDefault();
    dragDepth.current = 0;
    setOver(false);
    take(Array.from(e.dataTransfer.files));
  }

  // The row that held focus is gone; the picker is the next useful place.
  const refocus = () => requestAnimationFrame(() => inputRef.current?.focus());

  return (
    <div className="space-y-3">
      <div
        onDragEnter={(e) => {
          if (!hasFiles(e)) return;
          e.preventDefault();
          dragDepth.current++;
          setOver(true);
        }}
        onDragOver={(e) => {
          if (!hasFiles(e)) return;
          e.preventDefault();
          e.dataTransfer.dropEffect = 'copy';
        }}
        onDragLeave={() => {
          dragDepth.current = Math.max(0, dragDepth.current - 1);
          if (dragDepth.current === 0) setOver(false);
        }}
        onDrop={onDrop}
        className={`flex flex-col items-center gap-2 rounded-card border-2 border-dashed px-3 py-4 text-center transition-colors ${
          over ? 'border-blueprint bg-blueprint-soft' : 'border-paper-edge bg-white/40'
        }`}
      >
        <label
          className={buttonClasses(
            'primary',
            `min-h-[3.5rem] w-full cursor-pointer text-base ${compact ? 'px-3' : 'px-5'} focus-within:outline focus-within:outline-2 focus-within:outline-offset-2 focus-within:outline-blueprint ${compact ? '' : 'sm:w-auto'}`,
          )}
        >
          <UploadIcon />
          <span>Choose clips to upload</span>
          <input
            ref={inputRef}
            type="file"
            multiple
            accept="video/*,audio/*,image/*"
            className="sr-only"
            onChange={(e) => {
              take(Array.from(e.currentTarget.files ?? []));
              // Cleared so the same file can be picked again, which resumes it.
              e.currentTarget.value = '';
            }}
          />
        </label>
        {compact ? (
          <p className="text-xs text-ink-soft">
            <span className="hidden md:inline">Or drop files here. </span>Pick a stopped file again to resume it.
          </p>
        ) : (
          <p className="text-sm text-ink-soft">
            <span className="hidden md:inline">Or drop files here. </span>
            Video, audio or still images. An interrupted upload continues where it stopped when you pick the same file again.
          </p>
        )}
      </div>

      <p role="status" className="text-sm text-ink-soft empty:hidden">
        {notice}
      </p>

      {uploads.rows.length > 0 ? (
        <ul aria-label="Uploads" className="space-y-2">
          {uploads.rows.map((row) => (
            <UploadRowView
              key={row.id}
              row={row}
              onPause={() => uploads.pause(row.id)}
              onResume={() => uploads.resume(row.id)}
              onCancel={() => {
                uploads.cancel(row.id);
                setNotice(`Cancelled ${row.name}.`);
                refocus();
              }}
              onRemove={() => {
                uploads.remove(row.id);
                refocus();
              }}
            />
          ))}
        </ul>
      ) : null}
    </div>
  );
}

type RowProps = { row: UploadRow; onPause: () => void; onResume: () => void; onCancel: () => void; onRemove: () => void };

function UploadRowView({ row, onPause, onResume, onCancel, onRemove }: RowProps) {
  const running = row.state === 'waiting' || row.state === 'starting' || row.state === 'uploading' || row.state === 'reconnecting';
  const canResume = row.state === 'paused' || (row.state === 'failed' && row.retryable);
  const finished = row.state === 'done' || row.state === 'failed';
  const failed = row.state === 'failed';
  const name = <span className="sr-only"> {row.name}</span>;

  return (
    <li className={`space-y-2 rounded-md border bg-white/80 p-3 ${failed ? 'border-attention/60' : 'border-paper-edge'}`}>
      <p className="flex items-baseline justify-between gap-3">
        <span className="min-w-0 font-bold [overflow-wrap:anywhere]">{row.name}</span>
        <span className="shrink-0 font-mono text-sm text-ink-soft">{formatBytes(row.size)}</span>
      </p>
      <div
        role="progressbar"
        aria-label={`Upload progress for ${row.name}`}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={row.percent}
        aria-valuetext={`${row.percent} %`}
        className="h-3 overflow-hidden rounded-full bg-paper-deep"
      >
        <div className={`h-full rounded-full transition-[width] ${barTone(row)}`} style={{ width: `${row.percent}%` }} />
      </div>
      <p className="flex flex-wrap items-baseline gap-x-3 gap-y-1 text-sm">
        <span className="whitespace-nowrap font-mono tabular-nums">{row.percent} %</span>
        <span aria-live="polite" className={failed ? 'font-bold text-attention-ink' : row.state === 'done' ? 'font-bold text-ok' : 'text-ink-soft'}>
          {stateText(row)}
        </span>
        {row.state === 'uploading' && row.bytesPerSecond !== null ? (
          <span className="whitespace-nowrap font-mono text-ink-soft">{(row.bytesPerSecond / MiB).toFixed(1)} MiB/s</span>
        ) : null}
        {row.state === 'uploading' && row.secondsLeft !== null && row.sent < row.size ? (
          <span className="whitespace-nowrap text-ink-soft">{timeLeft(row.secondsLeft)}</span>
        ) : null}
      </p>
      {row.resumedFromPercent !== null && !finished ? <p className="text-sm text-ink-soft">Resuming from {row.resumedFromPercent} %</p> : null}
      <div className="flex flex-wrap gap-2">
        {/* One button in the first place whatever the state, so focus stays put when Pause becomes Resume. */}
        {running ? (
          <Button variant="secondary" onClick={onPause}>
            Pause{name}
          </Button>
        ) : canResume ? (
          <Button variant="secondary" onClick={onResume}>
            Resume{name}
          </Button>
        ) : (
          <Button variant="secondary" onClick={onRemove}>
            Remove{name}
          </Button>
        )}
        {running || row.state === 'paused' ? (
          <Button variant="danger" onClick={onCancel}>
            Cancel{name}
          </Button>
        ) : canResume ? (
          <Button variant="quiet" onClick={onRemove}>
            Remove{name}
          </Button>
        ) : null}
      </div>
    </li>
  );
}

function UploadIcon() {
  return (
    <svg aria-hidden="true" width="20" height="20" viewBox="0 0 20 20" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" strokeLinejoin="round">
      <path d="M10 13V3M5.5 7.5L10 3l4.5 4.5M3 13v3.5h14V13" />
    </svg>
  );
}
