'use client';

import Link from 'next/link';
import { useMemo, useState } from 'react';
import { CalendarDay } from '@/components/ui/calendar-day';
import { EmptyState } from '@/components/ui/empty-state';
import { SortableHead, type Sort, type SortColumn } from '@/components/ui/sortable-head';
import { editStageLabels } from '@/lib/edit/stages';
import { episodeStages, stageLabels, type EpisodeStage, type EpisodeSummaryDto } from '@/lib/episodes/schemas';
import { formatDuration } from '@/lib/runtime';
import { channelPage } from '@/lib/api/paths';

type SortKey = 'title' | 'stage' | 'shootDate' | 'publishDate' | 'forecastSeconds' | 'segmentCount';
const columns: SortColumn<SortKey>[] = [
  { key: 'title', label: 'Title' },
  { key: 'stage', label: 'Stage' },
  { key: 'shootDate', label: 'Shoot date' },
  { key: 'publishDate', label: 'Publish date' },
  { key: 'forecastSeconds', label: 'Runtime forecast' },
  { key: 'segmentCount', label: 'Segments' },
];

const stageOrder = Object.fromEntries(episodeStages.map((s, i) => [s, i])) as Record<EpisodeStage, number>;

function compare(a: EpisodeSummaryDto, b: EpisodeSummaryDto, key: SortKey): number {
  if (key === 'stage') return stageOrder[a.stage] - stageOrder[b.stage];
  const x = a[key];
  const y = b[key];
  // Missing dates sort last whichever way the column is sorted.
  if (x === null) return y === null ? 0 : 1;
  if (y === null) return -1;
  return typeof x === 'number' && typeof y === 'number' ? x - y : String(x).localeCompare(String(y));
}

export function EpisodesTable({ episodes, channelSlug }: { episodes: EpisodeSummaryDto[]; channelSlug: string }) {
  const [sort, setSort] = useState<Sort<SortKey>>({ key: 'publishDate', dir: 1 });
  const [stage, setStage] = useState<EpisodeStage | 'all'>('all');
  const [showArchived, setShowArchived] = useState(false);

  const rows = useMemo(() => {
    const visible = episodes.filter((e) => (stage === 'all' || e.stage === stage) && (showArchived || !e.archived));
    return visible.sort((a, b) => {
      const c = compare(a, b, sort.key);
      const nullsLast = (sort.key === 'shootDate' || sort.key === 'publishDate') && (a[sort.key] === null || b[sort.key] === null);
      return nullsLast ? c : c * sort.dir;
    });
  }, [episodes, stage, showArchived, sort]);

  return (
    <div>
      <div className="mb-4 flex flex-wrap items-end gap-4">
        <div>
          <label htmlFor="stage-filter" className="mb-1 block text-sm font-bold">
            Stage
          </label>
          <select
            id="stage-filter"
            value={stage}
            onChange={(e) => setStage(e.target.value as EpisodeStage | 'all')}
            className="min-h-touch rounded-md border border-ink/30 bg-white px-3"
          >
            <option value="all">All stages</option>
            {episodeStages.map((s) => (
              <option key={s} value={s}>
                {stageLabels[s]}
              </option>
            ))}
          </select>
        </div>
        {/* The table's headers sort on wider screens; the phone's cards have this instead. */}
        <div className="sm:hidden">
          <label htmlFor="episode-sort" className="mb-1 block text-sm font-bold">
            Sort by
          </label>
          <select
            id="episode-sort"
            value={sort.key}
            onChange={(e) => setSort({ key: e.target.value as SortKey, dir: 1 })}
            className="min-h-touch rounded-md border border-ink/30 bg-white px-3"
          >
            {columns.map((c) => (
              <option key={c.key} value={c.key}>
                {c.label}
              </option>
            ))}
          </select>
        </div>
        <label className="flex min-h-touch items-center gap-2 text-sm">
          <input type="checkbox" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} className="h-5 w-5" />
          Show archived
        </label>
      </div>
      {rows.length === 0 ? (
        <EmptyState title="No episodes match">Try another stage, or show archived episodes.</EmptyState>
      ) : (
        <>
          {/* A phone gets stacked cards: a seven-column table does not fit 375 px (issue 15). */}
          <ul aria-label="Episodes" className="space-y-3 sm:hidden">
            {rows.map((e) => (
              <EpisodeCard key={e.id} episode={e} channelSlug={channelSlug} />
            ))}
          </ul>
          <div className="relative hidden overflow-x-auto rounded-card border border-paper-edge bg-white/60 sm:block">
            <table className="w-full min-w-[44rem] text-left text-sm">
              <caption className="sr-only">Episodes, sorted by {columns.find((c) => c.key === sort.key)?.label}</caption>
              <SortableHead columns={columns} sort={sort} onSort={setSort} />
              <tbody className="divide-y divide-paper-edge">
                {rows.map((e) => (
                  <EpisodeRow key={e.id} episode={e} channelSlug={channelSlug} />
                ))}
              </tbody>
            </table>
          </div>
        </>
      )}
    </div>
  );
}

const Day = ({ day }: { day: string | null }) => (day ? <CalendarDay day={day} /> : <span className="text-ink-faint">—</span>);

function Runtime({ episode: e }: { episode: EpisodeSummaryDto }) {
  const over = e.targetSeconds !== null && e.forecastSeconds > e.targetSeconds;
  return (
    <>
      <span className={over ? 'font-bold text-attention-ink' : ''}>{formatDuration(e.forecastSeconds)}</span>
      {e.targetSeconds !== null ? <span className="text-ink-faint"> / {formatDuration(e.targetSeconds)}</span> : null}
      {over ? <span className="sr-only"> (over target)</span> : null}
    </>
  );
}

function EpisodeCard({ episode: e, channelSlug }: { episode: EpisodeSummaryDto; channelSlug: string }) {
  return (
    <li className="relative rounded-card border border-paper-edge bg-white/60 p-3">
      <Link href={channelPage(channelSlug, 'episodes', e.id)} className="font-bold text-blueprint underline-offset-2 hover:underline">
        {e.title}
      </Link>
      {e.archived ? <span className="ml-2 text-xs text-ink-faint">(archived)</span> : null}
      {e.premise ? <p className="text-xs text-ink-soft">{e.premise}</p> : null}
      <dl className="mt-2 grid grid-cols-2 gap-x-3 gap-y-1 text-sm">
        <div>
          <dt className="text-xs text-ink-faint">Stage</dt>
          <dd>
            {stageLabels[e.stage]}
            {e.editStage ? <span className="block text-xs text-ink-soft">Edit: {editStageLabels[e.editStage]}</span> : null}
          </dd>
        </div>
        <div>
          <dt className="text-xs text-ink-faint">Runtime forecast</dt>
          <dd className="whitespace-nowrap font-mono">
            <Runtime episode={e} />
          </dd>
        </div>
        <div>
          <dt className="text-xs text-ink-faint">Shoot date</dt>
          <dd>
            <Day day={e.shootDate} />
          </dd>
        </div>
        <div>
          <dt className="text-xs text-ink-faint">Publish date</dt>
          <dd>
            <Day day={e.publishDate} />
          </dd>
        </div>
        <div>
          <dt className="text-xs text-ink-faint">Segments</dt>
          <dd className="font-mono">{e.segmentCount}</dd>
        </div>
      </dl>
    </li>
  );
}

function EpisodeRow({ episode: e, channelSlug }: { episode: EpisodeSummaryDto; channelSlug: string }) {
  return (
    <tr className="hover:bg-paper/60">
      <td className="px-3 py-2">
        <Link href={channelPage(channelSlug, 'episodes', e.id)} className="font-bold text-blueprint underline-offset-2 hover:underline">
          {e.title}
        </Link>
        {e.archived ? <span className="ml-2 text-xs text-ink-faint">(archived)</span> : null}
        {e.premise ? <p className="text-xs text-ink-soft">{e.premise}</p> : null}
      </td>
      <td className="px-3 py-2">
        {stageLabels[e.stage]}
        {e.editStage ? <span className="block text-xs text-ink-soft">Edit: {editStageLabels[e.editStage]}</span> : null}
      </td>
      <td className="px-3 py-2">
        <Day day={e.shootDate} />
      </td>
      <td className="px-3 py-2">
        <Day day={e.publishDate} />
      </td>
      <td className="whitespace-nowrap px-3 py-2 font-mono">
        <Runtime episode={e} />
      </td>
      <td className="px-3 py-2 font-mono">{e.segmentCount}</td>
    </tr>
  );
}
