import type { PlanBoard } from '@/lib/cut-plans/build';
import { fitPieceLabel } from '@/lib/cut-plans/piece-label';
import { formatLength } from '@/lib/units';

/** Smallest label in viewBox units (the drawing is 1000 wide): about 5 px on a phone, 11 px on a desktop. */
const MIN_LABEL = 12;

type Props = { board: PlanBoard; sheet: boolean; unit: 'in' | 'mm'; title: string; cutCounts?: Map<string, number> | undefined };

/**
 * One board or sheet drawn to scale, its length running left to right. Gaps between pieces are the
 * kerfs; the hatched tail of a board is its offcut.
 */
export function BoardDiagram({ board, sheet, unit, title, cutCounts }: Props) {
  const fmt = (n: number) => formatLength(n, { unit });
  const scale = 1000 / Math.max(board.lengthIn, 1);
  const w = board.lengthIn * scale;
  const h = Math.max(board.widthIn * scale, sheet ? 0 : 60);
  const labelSize = Math.max(14, Math.min(28, h / 4));
  return (
    <figure className={`break-inside-avoid ${sheet ? 'max-w-xl' : ''}`}>
      <svg viewBox={`-2 -2 ${w + 4} ${h + 4}`} role="img" aria-label={title} className="h-auto w-full">
        <title>{title}</title>
        <defs>
          <pattern id="offcut-hatch" width="12" height="12" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <line x1="0" y1="0" x2="0" y2="12" className="stroke-blueprint-line" strokeWidth="4" />
          </pattern>
        </defs>
        <rect x="0" y="0" width={w} height={h} fill="url(#offcut-hatch)" className="stroke-blueprint" strokeWidth="2" />
        {board.pieces.map((p) => {
          // Sheets: x runs across the width, y along the length; drawn with the length horizontal.
          const x = p.y * scale;
          const y = sheet ? p.x * scale : 0;
          const pw = p.lengthIn * scale;
          const ph = sheet ? p.widthIn * scale : h;
          const cut = (cutCounts?.get(p.partId) ?? 0) > p.pieceIndex;
          const size = `${fmt(p.lengthIn)}${sheet ? ` × ${fmt(p.widthIn)}` : ''}`;
          // Shortened to stay inside its piece (issue 15); the tooltip keeps the whole label.
          const label = fitPieceLabel(p.name, size, { width: pw, height: ph }, labelSize, MIN_LABEL);
          return (
            <g key={`${p.partId}-${p.pieceIndex}`}>
              <title>{`${p.name} ${size}`}</title>
              <rect x={x} y={y} width={pw} height={ph} className={cut ? 'fill-ok-soft stroke-ok' : 'fill-blueprint-soft stroke-blueprint'} strokeWidth="2" />
              {label ? (
                <text x={x + pw / 2} y={y + ph / 2} textAnchor="middle" dominantBaseline="middle" fontSize={label.fontSize} className="fill-ink font-mono">
                  {label.text}
                </text>
              ) : null}
            </g>
          );
        })}
      </svg>
      <figcaption className="mt-1 text-xs text-ink-faint">
        {title}
        {!sheet && board.offcutIn > 0 ? ` · offcut ${fmt(board.offcutIn)}${board.keepOffcut ? ' (keep)' : ' (scrap)'}` : ''}
      </figcaption>
    </figure>
  );
}
