import Link from 'next/link';
import type { ShotsView } from './board-query';

const tabs: { view: ShotsView; label: string; query: string }[] = [
  { view: 'board', label: 'Shop board', query: '' },
  { view: 'mine', label: 'My shots', query: '?view=mine' },
];

/** Two views of one page, as links so each has its own URL and works without script. */
export function ViewTabs({ slug, current }: { slug: string; current: ShotsView }) {
  return (
    <nav aria-label="Shot views" className="mb-5 border-b border-paper-edge">
      <ul className="-mb-px flex gap-1">
        {tabs.map((t) => {
          const active = t.view === current;
          return (
            <li key={t.view}>
              <Link
                href={`/c/${slug}/shots${t.query}`}
                aria-current={active ? 'page' : undefined}
                className={`inline-flex min-h-touch items-center rounded-t-md border px-4 text-sm font-bold ${
                  active ? 'border-paper-edge border-b-paper bg-paper text-ink' : 'border-transparent text-ink-soft hover:bg-paper-deep hover:text-ink'
                }`}
              >
                {t.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
