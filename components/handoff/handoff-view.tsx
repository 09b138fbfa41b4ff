import Link from 'next/link';
import { LocalTime } from '@/components/shop-board/dates';
import { PrintButton } from '@/components/shoot-sheet/print-button';
import { scriptProseClasses } from '@/components/script/script-prose';
import { buttonClasses } from '@/components/ui/button';
import type { HandoffPageData } from '@/lib/handoffs/page-data';
import { clipsOfAll } from '@/lib/handoffs/assembly';
import type { SnapshotSegment } from '@/lib/handoffs/snapshot';
import { formatDuration } from '@/lib/runtime';
import { kindLabels } from '@/lib/segments/schemas';
import { cameraLabels, framingLabels, shotStateLabels } from '@/lib/shots/catalog';
import { frameRates, framesToTimecode, secondsToFrames, type FrameRate } from '@/lib/timecode';
import { ChangesBanner } from './changes-banner';
import { EditStageSelect } from './edit-stage-select';
import { HandoffClip } from './handoff-clip';
import { NotesPanel } from './notes-panel';
import { PlayerTimeProvider } from './player-time';

type Props = { slug: string; data: HandoffPageData };

const forecastTc = (seconds: number, rate: FrameRate) => framesToTimecode(secondsToFrames(seconds, rate), rate);

/** The editor's view of one locked version: made to sit beside an editing program, and to print. */
export function HandoffView({ slug, data }: Props) {
  const { handoff, episode, versions, changes } = data;
  const snap = handoff.snapshot;
  const rate = frameRates[snap.episode.frameRate];
  const stored = new Set(data.storedClipIds);
  const api = `/api/channels/${slug}/episodes/${episode.id}/handoffs/${handoff.version}`;
  const targets = [
    ...snap.segments.map((s) => ({ value: `segment:${s.id}`, label: `Segment ${s.number}. ${s.title}` })),
    ...snap.segments.flatMap((s) => clipsOfAll({ ...snap, segments: [s] }).map((c) => ({ value: `clip:${c.id}`, label: `Clip ${c.name} (${s.number}. ${s.title})` }))),
  ];
  const targetLabels = Object.fromEntries(targets.map((t) => [t.value.split(':')[1]!, t.label]));

  return (
    <PlayerTimeProvider>
      <article className="print:text-black">
        <header className="mb-6 flex flex-wrap items-start justify-between gap-4 border-b border-paper-edge pb-4 print:border-black">
          <div className="min-w-0 md:flex-1">
            <p className="text-sm text-ink-faint">Handoff, locked version</p>
            <h1 className="text-2xl font-bold tracking-tight">
              {snap.episode.title} <span className="font-mono">v{snap.version}</span>
            </h1>
            <dl className="mt-2 flex flex-wrap gap-x-5 gap-y-1 text-sm">
              <Pair label="Locked">
                <LocalTime iso={snap.lockedAt} /> by {snap.lockedBy}
              </Pair>
              <Pair label="Frame rate">
                <span className="font-mono">{rate.label}</span>
              </Pair>
              <Pair label="Forecast runtime">
                <span className="font-mono">{formatDuration(snap.episode.totalSeconds)}</span>
              </Pair>
              <Pair label="Content hash">
                <span className="font-mono" title={handoff.contentHash}>
                  {handoff.contentHash.slice(0, 12)}
                </span>
              </Pair>
            </dl>
            {snap.note ? <p className="mt-3 max-w-prose rounded-md bg-white/70 px-3 py-2">Note from the host: {snap.note}</p> : null}
          </div>
          <div className="flex flex-col items-start gap-3">
            <EditStageSelect slug={slug} episodeId={episode.id} initial={episode.editStage} canEdit={data.canWriteNotes} />
            <PrintButton />
          </div>
        </header>

        {changes ? <ChangesBanner diff={changes} /> : null}

        <nav aria-label="Downloads" className="mb-6 flex flex-wrap gap-2 print:hidden">
          <a className={buttonClasses('primary')} href={`${api}/exports/zip`}>
            Clip package (ZIP)
          </a>
          <a className={buttonClasses('secondary')} href={`${api}/exports/otio`}>
            OTIO
          </a>
          <a className={buttonClasses('secondary')} href={`${api}/exports/edl`}>
            EDL
          </a>
          <a className={buttonClasses('secondary')} href={`${api}/exports/csv`}>
            Shots CSV
          </a>
        </nav>

        <div className="grid gap-6 lg:grid-cols-[1fr_22rem] print:block">
          <div className="min-w-0">
            <section aria-labelledby="order-heading">
              <h2 id="order-heading" className="mb-2 text-lg font-bold">
                Running order
              </h2>
              <table className="w-full text-left text-sm">
                <caption className="sr-only">Segments with forecast start timecodes</caption>
                <thead>
                  <tr className="border-b border-paper-edge">
                    <th scope="col" className="py-1 pr-2">#</th>
                    <th scope="col" className="py-1 pr-2">Starts (forecast)</th>
                    <th scope="col" className="py-1 pr-2">Segment</th>
                    <th scope="col" className="py-1">Runs</th>
                  </tr>
                </thead>
                <tbody>
                  {snap.segments.map((s) => (
                    <tr key={s.id} className="border-b border-paper-edge/60">
                      <td className="py-1 pr-2 font-mono">{s.number}</td>
                      <td className="py-1 pr-2 font-mono">{forecastTc(s.startSeconds, rate)}</td>
                      <td className="py-1 pr-2">
                        <a href={`#segment-${s.number}`} className="underline">
                          {s.title}
                        </a>
                      </td>
                      <td className="py-1 font-mono">{formatDuration(s.totalSeconds)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </section>

            {snap.sponsorDeliverables.length ? (
              <section aria-labelledby="sponsor-heading" className="mt-6">
                <h2 id="sponsor-heading" className="mb-2 text-lg font-bold">
                  What the sponsor read must contain
                </h2>
                <ul className="grid gap-2">
                  {snap.sponsorDeliverables.map((d) => (
                    <li key={d.id} className="rounded-md border border-paper-edge bg-white p-3 text-sm">
                      <p className="font-bold">
                        {d.sponsorName}
                        {d.forecastStartSeconds !== null ? <span className="ml-2 font-mono">{forecastTc(d.forecastStartSeconds, rate)}</span> : null}
                      </p>
                      <p>Disclosure: {d.disclosure}</p>
                      <p>Placement: {d.placementRule}</p>
                      <ul className="list-disc pl-5">
                        {d.talkingPoints.map((t, i) => (
                          <li key={i}>{t}</li>
                        ))}
                      </ul>
                    </li>
                  ))}
                </ul>
              </section>
            ) : null}

            {snap.segments.map((s) => (
              <SegmentBlock key={s.id} slug={slug} segment={s} rate={rate} stored={stored} packageUrl={`${api}/segments/${s.id}/package`} />
            ))}
          </div>

          <aside className="grid content-start gap-6 print:mt-6 print:block">
            <NotesPanel
              slug={slug}
              episodeId={episode.id}
              version={handoff.version}
              frameRate={rate.id}
              targets={targets}
              targetLabels={targetLabels}
              initial={data.notes}
              canWrite={data.canWriteNotes}
            />
            <section aria-labelledby="versions-heading" className="print:hidden">
              <h2 id="versions-heading" className="text-lg font-bold">
                Versions
              </h2>
              <ol className="mt-2 grid gap-1 text-sm">
                {versions.map((v) => (
                  <li key={v.id} className="flex flex-wrap items-center gap-x-3">
                    {v.version === handoff.version ? (
                      <span className="inline-flex min-h-touch items-center font-bold" aria-current="page">
                        v{v.version} (this one)
                      </span>
                    ) : (
                      <>
                        <Link href={`/c/${slug}/episodes/${episode.id}/handoff/${v.version}`} className="inline-flex min-h-touch items-center underline">
                          v{v.version}
                        </Link>
                        {v.version < handoff.version ? (
                          <Link href={`?since=${v.version}`} className="inline-flex min-h-touch items-center text-blueprint underline">
                            changes since v{v.version}
                          </Link>
                        ) : null}
                      </>
                    )}
                  </li>
                ))}
              </ol>
            </section>
          </aside>
        </div>
      </article>
    </PlayerTimeProvider>
  );
}

function Pair({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="flex gap-1">
      <dt className="text-ink-faint">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}

function SegmentBlock({ slug, segment: s, rate, stored, packageUrl }: { slug: string; segment: SnapshotSegment; rate: FrameRate; stored: Set<string>; packageUrl: string }) {
  return (
    <section id={`segment-${s.number}`} aria-labelledby={`segment-${s.number}-heading`} className="mt-8 break-inside-avoid-page border-t border-paper-edge pt-4 print:border-black">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={`segment-${s.number}-heading`} className="text-xl font-bold">
          <span className="font-mono">{s.number}.</span> {s.title}
        </h2>
        <a href={packageUrl} className="inline-flex min-h-touch items-center text-sm underline print:hidden">
          Download this segment’s clips<span className="sr-only"> ({s.title})</span>
        </a>
      </div>
      <p className="text-sm text-ink-soft">
        {kindLabels[s.kind]}
        {s.levelLabel ? ` · ${s.levelLabel}` : ''} · starts <span className="font-mono">{forecastTc(s.startSeconds, rate)}</span> · runs{' '}
        <span className="font-mono">{formatDuration(s.totalSeconds)}</span>
      </p>
      {s.safety.length ? (
        <div className={`mt-3 rounded-md border-l-4 px-3 py-2 text-sm ${s.safetyReviewed ? 'border-paper-edge bg-white' : 'border-attention bg-attention-soft text-attention-ink'}`}>
          <p className="font-bold">{s.safetyReviewed ? 'Safety notes (reviewed by the host)' : 'Safety notes (not reviewed yet)'}</p>
          <ul className="list-disc pl-5">
            {s.safety.map((t) => (
              <li key={t.tool}>
                {t.label}
                {t.cautions.length ? `: ${t.cautions.join(' ')}` : ''}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      <h3 className="mt-4 font-bold">Script</h3>
      {s.scriptHtml ? (
        // The HTML comes from the static renderer of a validated script document, at lock time.
        <div className={`mt-1 max-w-prose ${scriptProseClasses}`} dangerouslySetInnerHTML={{ __html: s.scriptHtml }} />
      ) : (
        <p className="italic text-ink-faint">No script in this version.</p>
      )}
      <h3 className="mt-4 font-bold">Shots</h3>
      {s.shots.length === 0 ? <p className="text-sm text-ink-faint">No shots planned.</p> : null}
      <ol className="mt-1 grid gap-3">
        {s.shots.map((sh) => (
          <li key={sh.id} className="rounded-md border border-paper-edge bg-white/60 p-3">
            <p className="flex flex-wrap gap-x-3">
              <span className="font-mono font-bold">S{String(sh.number).padStart(2, '0')}</span>
              <span>{sh.description}</span>
              <span className="text-sm text-ink-soft">
                {framingLabels[sh.framing]} · {cameraLabels[sh.camera]}
              </span>
              <span className={`text-sm font-bold ${sh.state === 'retake' ? 'text-attention-ink' : ''}`}>{shotStateLabels[sh.state]}</span>
            </p>
            {sh.retakeReason ? <p className="mt-1 text-sm text-attention-ink">Retake: {sh.retakeReason}</p> : null}
            {sh.clips.length ? (
              <ul className="mt-2 grid gap-2" aria-label={`Clips of shot ${sh.number}`}>
                {sh.clips.map((c) => (
                  <HandoffClip key={c.id} slug={slug} clip={c} stored={stored.has(c.id)} />
                ))}
              </ul>
            ) : (
              <p className="mt-1 text-sm text-ink-faint">No clip yet.</p>
            )}
          </li>
        ))}
      </ol>
      {s.otherClips.length ? (
        <>
          <h3 className="mt-4 font-bold">Other clips of this segment</h3>
          <ul className="mt-1 grid gap-2">
            {s.otherClips.map((c) => (
              <HandoffClip key={c.id} slug={slug} clip={c} stored={stored.has(c.id)} />
            ))}
          </ul>
        </>
      ) : null}
    </section>
  );
}
