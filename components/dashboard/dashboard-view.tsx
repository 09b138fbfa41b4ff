import Link from 'next/link';
import { CalendarDay } from '@/components/ui/calendar-day';
import { buttonClasses } from '@/components/ui/button';
import { DueText } from '@/components/sponsors/due-text';
import type { DashboardDto, DashboardEpisode } from '@/lib/dashboard/queries';
import { stageLabels } from '@/lib/episodes/schemas';
import { formatDuration } from '@/lib/runtime';
import { dueDateLabels } from '@/lib/sponsors/schemas';

const dueLabels = { overdue: 'Overdue', today: 'Today', tomorrow: 'Tomorrow' } as const;

function Panel({ id, title, children }: { id: string; title: string; children: React.ReactNode }) {
  return (
    <section aria-labelledby={id} className="rounded-card border border-paper-edge bg-white/60 p-5 shadow-card">
      <h2 id={id} className="mb-3 text-lg font-bold">
        {title}
      </h2>
      {children}
    </section>
  );
}

const Quiet = ({ children }: { children: React.ReactNode }) => <p className="text-sm text-ink-soft">{children}</p>;

/** "What needs me": each section only for the roles it concerns, each with its own empty state. */
export function DashboardView({ data, slug, canEditEpisodes }: { data: DashboardDto; slug: string; canEditEpisodes: boolean }) {
  const base = `/c/${slug}`;
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      {data.dueDates ? (
        <Panel id="due-heading" title="Sponsor due dates">
          {data.dueDates.length === 0 ? (
            <Quiet>Nothing overdue and nothing due in the next 14 days.</Quiet>
          ) : (
            <ul className="divide-y divide-paper-edge">
              {data.dueDates.map((d) => (
                <li key={`${d.deliverableId}-${d.kind}`} className="flex flex-wrap items-center justify-between gap-2 py-2">
                  <Link href={`${base}/sponsors/${d.dealId}`} className="min-h-touch content-center font-bold text-blueprint underline-offset-2 hover:underline">
                    {dueDateLabels[d.kind]} · {d.sponsorName}
                    <span className="block text-xs font-normal text-ink-soft">{d.episodeTitle}</span>
                  </Link>
                  <DueText dueOn={d.dueOn} today={data.today} />
                </li>
              ))}
            </ul>
          )}
        </Panel>
      ) : null}
      {data.myShots ? (
        <Panel id="shots-heading" title="My shots due">
          {data.myShots.length === 0 ? (
            <Quiet>No shot of yours is overdue or due today or tomorrow.</Quiet>
          ) : (
            <ul className="divide-y divide-paper-edge">
              {data.myShots.map((s) => (
                <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                  <Link href={`${base}/episodes/${s.episodeId}/segments/${s.segmentId}`} className="min-h-touch content-center text-blueprint underline-offset-2 hover:underline">
                    <span className="font-bold">{s.description}</span>
                    <span className="block text-xs text-ink-soft">
                      {s.episodeTitle} · {s.segmentTitle}
                    </span>
                  </Link>
                  <span className={`text-sm font-bold ${s.due === 'tomorrow' ? 'text-ink' : 'text-attention-ink'}`}>{dueLabels[s.due]}</span>
                </li>
              ))}
            </ul>
          )}
          <Link href={`${base}/shots`} className="mt-3 inline-block text-sm font-bold text-blueprint underline">
            Open the shop board
          </Link>
        </Panel>
      ) : null}
      {data.safetyReviews && data.safetyReviews.length > 0 ? (
        <Panel id="safety-heading" title="Safety reviews before the shoot">
          <p className="text-sm text-ink-soft">
            {canEditEpisodes ? 'Review the tool cautions on each segment page' : 'A Host reviews the tool cautions'} before shoot day; until then their shots cannot be marked Captured.
          </p>
          <ul className="mt-2 divide-y divide-paper-edge">
            {data.safetyReviews.map((r) => (
              <li key={r.segmentId} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <Link href={`${base}/episodes/${r.episodeId}/segments/${r.segmentId}`} className="min-h-touch content-center text-blueprint underline-offset-2 hover:underline">
                  <span className="font-bold">{r.segmentTitle}</span>
                  <span className="block text-xs text-ink-soft">{r.episodeTitle}</span>
                </Link>
                <span className="text-sm font-bold text-attention-ink">{r.shootDate ? <>Shoot <CalendarDay day={r.shootDate} /></> : 'No shoot date'}</span>
              </li>
            ))}
          </ul>
        </Panel>
      ) : null}
      {data.changedSinceApproval && data.changedSinceApproval.length > 0 ? (
        <Panel id="approval-heading" title="Changed since approval">
          <ul className="divide-y divide-paper-edge">
            {data.changedSinceApproval.map((d) => (
              <li key={d.id} className="py-2">
                <Link
                  href={canEditEpisodes ? `${base}/sponsors/${d.dealId}` : `${base}/episodes/${d.episodeId}/segments/${d.segmentId ?? ''}`}
                  className="font-bold text-attention-ink underline-offset-2 hover:underline"
                >
                  {d.sponsorName} · {d.episodeTitle}
                </Link>
                <p className="text-sm text-ink-soft">The read&apos;s script was saved after the sponsor approved it{d.segmentTitle ? ` (${d.segmentTitle})` : ''}.</p>
              </li>
            ))}
          </ul>
        </Panel>
      ) : null}
      {data.readyForEdit ? (
        <Panel id="edit-heading" title="Ready for the edit">
          {data.readyForEdit.length === 0 ? <Quiet>No episode is at the Edit stage yet. When the Host moves one there, it shows here.</Quiet> : <EpisodeList episodes={data.readyForEdit} base={base} />}
        </Panel>
      ) : null}
      <Panel id="progress-heading" title="Episodes in progress">
        {data.inProgress.length === 0 ? (
          <div>
            <Quiet>
              {canEditEpisodes ? 'No episode is between Outline and Edit. Outline one and its forecast and shots show here.' : 'No episode is in progress yet. When the Host outlines one, it shows here.'}
            </Quiet>
            {canEditEpisodes ? (
              <Link href={`${base}/episodes`} className={buttonClasses('primary', 'mt-3')}>
                Go to episodes
              </Link>
            ) : null}
          </div>
        ) : (
          <EpisodeList episodes={data.inProgress} base={base} />
        )}
      </Panel>
    </div>
  );
}

function EpisodeList({ episodes, base }: { episodes: DashboardEpisode[]; base: string }) {
  return (
    <ul className="divide-y divide-paper-edge">
      {episodes.map((e) => {
        const over = e.targetSeconds !== null && e.forecastSeconds > e.targetSeconds;
        return (
          <li key={e.id} className="py-2">
            <Link href={`${base}/episodes/${e.id}`} className="font-bold text-blueprint underline-offset-2 hover:underline">
              {e.title}
            </Link>
            <p className="flex flex-wrap gap-x-4 text-sm text-ink-soft">
              <span>{stageLabels[e.stage]}</span>
              <span className={over ? 'font-bold text-attention-ink' : ''}>
                Forecast <span className="font-mono">{formatDuration(e.forecastSeconds)}</span>
                {e.targetSeconds !== null ? (
                  <>
                    {' '}
                    of <span className="font-mono">{formatDuration(e.targetSeconds)}</span>
                    {over ? ' (over target)' : ''}
                  </>
                ) : null}
              </span>
              <span>
                Shots <span className="font-mono">{e.shotsCaptured}/{e.shotsTotal}</span> captured
              </span>
            </p>
          </li>
        );
      })}
    </ul>
  );
}
