import { Fragment } from 'react';
import type { PartDto } from '@/lib/parts/schemas';
import { formatLength } from '@/lib/units';

const th = 'px-2 py-1 text-left text-xs font-bold uppercase tracking-wide text-ink-soft';
const td = 'px-2 py-1.5 align-top';

export function PartsTable({ parts, unit, segmentTitle }: { parts: PartDto[]; unit: 'in' | 'mm'; segmentTitle: string }) {
  const fmt = (n: number | null) => (n === null ? '—' : formatLength(n, { unit }));
  // A part with only a length (a dowel, a rod) reads better without two empty places.
  const dims = (p: PartDto) => (p.widthIn === null && p.thicknessIn === null ? [p.lengthIn] : [p.lengthIn, p.widthIn, p.thicknessIn]);
  return (
    <table className="w-full border-collapse text-sm">
      <caption className="sr-only">Parts for {segmentTitle}</caption>
      <thead>
        <tr className="border-b border-ink/30">
          <th scope="col" className={th}>
            Part
          </th>
          <th scope="col" className={`${th} text-right`}>
            Qty
          </th>
          <th scope="col" className={th}>
            Finished size <span className="font-normal normal-case">(L × W × T)</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {parts.map((p) => (
          <tr key={p.id} className="break-inside-avoid border-b border-paper-edge">
            <td className={td}>
              {p.name}
              {p.note ? <p className="text-xs text-ink-soft">{p.note}</p> : null}
            </td>
            <td className={`${td} text-right font-mono tabular-nums`}>{p.quantity}</td>
            <td className={`${td} font-mono`}>
              {dims(p).map((n, i) => (
                // One measurement never breaks across lines; the line may break between them.
                <Fragment key={i}>
                  {i > 0 ? ' × ' : ''}
                  <span className="whitespace-nowrap">{fmt(n)}</span>
                </Fragment>
              ))}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
