import { cameraLabels, framingLabels, shotStateLabels, type ShotState } from '@/lib/shots/catalog';
import type { ShotDto } from '@/lib/shots/schemas';

const stateTone: Record<ShotState, string> = {
  planned: 'text-ink-soft',
  captured: 'text-ok',
  retake: 'text-attention-ink',
};

const th = 'px-2 py-1.5 text-left text-xs font-bold uppercase tracking-wide text-ink-soft';
const td = 'px-2 py-2 align-top';

export function ShotsTable({ shots, segmentTitle }: { shots: ShotDto[]; segmentTitle: string }) {
  return (
    <table className="w-full border-collapse text-sm">
      <caption className="sr-only">Shots for {segmentTitle}</caption>
      <thead>
        <tr className="border-b border-ink/30">
          <th scope="col" className={`${th} w-10`}>
            #
          </th>
          <th scope="col" className={`${th} hidden w-32 sm:table-cell`}>
            Framing
          </th>
          <th scope="col" className={`${th} hidden w-24 sm:table-cell`}>
            Camera
          </th>
          <th scope="col" className={th}>
            Shot
          </th>
          <th scope="col" className={`${th} hidden w-32 sm:table-cell`}>
            Assignee
          </th>
          <th scope="col" className={`${th} w-24`}>
            State
          </th>
        </tr>
      </thead>
      <tbody>
        {shots.map((shot) => (
          <tr key={shot.id} className="break-inside-avoid border-b border-paper-edge">
            <td className={`${td} font-mono font-bold tabular-nums`}>{shot.number}</td>
            <td className={`${td} hidden sm:table-cell`}>{framingLabels[shot.framing]}</td>
            <td className={`${td} hidden sm:table-cell`}>{cameraLabels[shot.camera]}</td>
            <td className={td}>
              <p className="break-words">{shot.description}</p>
              {/* On a phone only the description, number and state get columns; the rest goes under the description. */}
              <p className="text-xs text-ink-soft sm:hidden">
                {framingLabels[shot.framing]} · {cameraLabels[shot.camera]} · {shot.assigneeName ?? 'Unassigned'}
              </p>
              {shot.notes ? <p className="text-xs text-ink-soft">{shot.notes}</p> : null}
              {shot.state === 'retake' && shot.retakeReason ? <p className="text-xs font-bold text-attention-ink">Retake: {shot.retakeReason}</p> : null}
            </td>
            <td className={`${td} hidden break-words sm:table-cell`}>{shot.assigneeName ?? <span className="text-ink-faint">Unassigned</span>}</td>
            <td className={td}>
              <span className="flex items-center gap-2">
                {/* A box to tick on paper. */}
                <span aria-hidden="true" className="hidden size-4 shrink-0 border border-black print:inline-block" />
                <span className={`font-bold ${stateTone[shot.state]}`}>{shotStateLabels[shot.state]}</span>
              </span>
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
