import type { EpisodeDto } from '@/lib/episodes/schemas';
import { longDate } from './dates';
import { PrintButton } from './print-button';
import { ShootDateForm } from './shoot-date-form';
import { Breadcrumb } from '@/components/ui/breadcrumb';
import { channelPage } from '@/lib/api/paths';

type Props = {
  channelSlug: string;
  channelName: string;
  episode: EpisodeDto;
  /** The day shown; null when there is none (no shoot date set, or a bad date in the URL). */
  date: string | null;
  dateError?: string | undefined;
};

export function ShootSheetHeader({ channelSlug, channelName, episode, date, dateError }: Props) {
  const episodeHref = channelPage(channelSlug, 'episodes', episode.id);
  return (
    <>
      <Breadcrumb items={[{ href: channelPage(channelSlug, 'episodes'), label: 'Episodes' }, { href: episodeHref, label: episode.title }]} />
      <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-paper-edge pb-4 print:mb-4 print:border-black print:pb-2">
        <div className="min-w-0">
          <p className="text-xs font-bold uppercase tracking-wide text-ink-faint">{channelName}</p>
          <h1 className="text-2xl font-bold tracking-tight">Shoot-day sheet</h1>
          <p className="text-lg font-bold leading-snug">{episode.title}</p>
          <p className="mt-1 text-ink-soft">
            {date ? (
              <>
                <time dateTime={date} className="font-bold text-ink">
                  {longDate(date)}
                </time>
                {episode.shootDate && episode.shootDate !== date ? (
                  <span className="text-sm"> · the episode’s shoot date is {longDate(episode.shootDate)}</span>
                ) : null}
              </>
            ) : dateError ? (
              'No day chosen.'
            ) : (
              'This episode has no shoot date yet, so every shot is listed. Pick a day to see only its shots.'
            )}
          </p>
        </div>
        <div className="flex flex-wrap items-start gap-3 print:hidden">
          <ShootDateForm action={`${episodeHref}/shoot-sheet`} date={date} error={dateError} />
          <div className="mt-6">
            <PrintButton />
          </div>
        </div>
      </header>
    </>
  );
}
