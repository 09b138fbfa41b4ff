'use client';

export type Sort<K extends string> = { key: K; dir: 1 | -1 };
export type SortColumn<K extends string> = { key: K; label: string };

/** A column header pressed again turns its order round; another column starts ascending. */
export const nextSort = <K extends string>(sort: Sort<K>, key: K): Sort<K> => ({ key, dir: sort.key === key ? ((-sort.dir) as 1 | -1) : 1 });

/** A table's header row of sort buttons, with aria-sort on the column the rows follow. */
export function SortableHead<K extends string>({ columns, sort, onSort }: { columns: readonly SortColumn<K>[]; sort: Sort<K>; onSort: (next: Sort<K>) => void }) {
  return (
    <thead className="border-b border-paper-edge bg-paper-deep/60">
      <tr>
        {columns.map((c) => (
          <th key={c.key} scope="col" aria-sort={sort.key === c.key ? (sort.dir === 1 ? 'ascending' : 'descending') : 'none'} className="p-0">
            <button type="button" onClick={() => onSort(nextSort(sort, c.key))} className="flex min-h-touch w-full items-center gap-1 px-3 font-bold hover:bg-paper">
              {c.label}
              <span aria-hidden="true" className="text-ink-faint">
                {sort.key === c.key ? (sort.dir === 1 ? '▲' : '▼') : ''}
              </span>
            </button>
          </th>
        ))}
      </tr>
    </thead>
  );
}
