import type { PlanBoard } from '@/lib/cut-plans/build';
import { offcutSize } from '@/lib/cut-plans/cut-records';
import { fitPieceLabel } from '@/lib/cut-plans/piece-label';
import { formatLength } from '@/lib/units';

/** Smallest label in viewBox units (the drawing is 1000 wide): about 5 px on a phone, 11 px on a desktop. */
const MIN_LABEL = 12;

type Props = { board: PlanBoard; sheet: boolean; unit: 'in' | 'mm'; title: string; cutCounts?: Map<string, number> | undefined };

/**
 * One board or sheet drawn to scale, its length running left to right. Gaps between pieces are the
 * kerfs; the hatched tail of a board is its offcut. A ripped board shows its strips across the width,
 * the dashed rip lines numbered in cut order, and lists "rip to …, then crosscut" per strip; a length
 * left past the longest strip is crosscut off first and shown as the board's offcut.
 */
export function BoardDiagram({ board, sheet, unit, title, cutCounts }: Props) {
  const fmt = (n: number) => formatLength(n, { unit });
  const scale = 1000 / Math.max(board.lengthIn, 1);
  const strips = sheet ? undefined : board.strips;
  // Ripped boards are drawn across their width too; a narrow board is stretched across only to stay legible.
  const scaleY = strips ? Math.max(scale, 60 / Math.max(board.widthIn, 1e-6)) : scale;
  const w = board.lengthIn * scale;
  const h = strips ? board.widthIn * scaleY : Math.max(board.widthIn * scale, sheet ? 0 : 60);
  const labelSize = Math.max(14, Math.min(28, h / 4));
  // A ripped board with an offcut is first crosscut just past its longest strip, so the rips stop there.
  const crosscutAt = strips && board.offcutIn > 0 ? Math.max(0, ...board.pieces.map((p) => p.y + p.lengthIn)) : null;
  const ripEnd = crosscutAt === null ? w : crosscutAt * scale;
  // A sheet's offcut is freed by one cut right through it: across (the full width) or along (the full length).
  const sheetCut = sheet && board.offcutWidthIn !== undefined && board.offcutIn > 0 ? sheetOffcutLine(board, scale) : null;
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
          const y = sheet ? p.x * scale : strips ? p.x * scaleY : 0;
          const pw = p.lengthIn * scale;
          const ph = sheet ? p.widthIn * scale : strips ? p.widthIn * scaleY : h;
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
        {strips?.map((st, i) => (
          // Rip line after each strip, numbered in cut order.
          <g key={`rip-${i}`}>
            <line x1="0" x2={ripEnd} y1={(st.x + st.widthIn) * scaleY} y2={(st.x + st.widthIn) * scaleY} className="stroke-blueprint" strokeWidth="2" strokeDasharray="10 6" />
            <text x="6" y={st.x * scaleY + Math.min(labelSize, st.widthIn * scaleY * 0.8)} fontSize={Math.min(labelSize, st.widthIn * scaleY * 0.8)} className="fill-blueprint font-mono">
              {i + 1}
            </text>
          </g>
        ))}
        {sheetCut ? <line {...sheetCut} className="stroke-blueprint" strokeWidth="3" /> : null}
        {crosscutAt !== null ? <line x1={ripEnd} x2={ripEnd} y1="0" y2={h} className="stroke-blueprint" strokeWidth="3" /> : null}
      </svg>
      <figcaption className="mt-1 text-xs text-ink-faint">
        {title}
        {board.offcutIn > 0 ? ` · offcut ${offcutSize(board, fmt)}${board.keepOffcut ? ' (keep)' : ' (scrap)'}` : ''}
      </figcaption>
      {crosscutAt !== null ? (
        <p className="mt-1 text-sm">
          First crosscut at <span className="font-mono">{fmt(crosscutAt)}</span>; the rest is the offcut ({board.keepOffcut ? 'keep' : 'scrap'}). Then:
        </p>
      ) : null}
      {strips && strips.length > 0 ? (
        <ol className="mt-1 list-decimal pl-6 text-sm">
          {strips.map((st, i) => (
            <li key={i}>
              Rip to <span className="font-mono">{fmt(st.widthIn)}</span>, then crosscut
            </li>
          ))}
        </ol>
      ) : null}
    </figure>
  );
}

/** Where the through-cut that frees a sheet's offcut runs, drawn with the sheet's length horizontal. */
function sheetOffcutLine(board: PlanBoard, scale: number) {
  const w = board.lengthIn * scale;
  const h = board.widthIn * scale;
  // Across the sheet: the offcut keeps the full width and is the last `offcutIn` of the length.
  if (board.offcutWidthIn === board.widthIn && board.offcutIn < board.lengthIn) {
    const x = (board.lengthIn - board.offcutIn) * scale;
    return { x1: x, x2: x, y1: 0, y2: h };
  }
  const y = (board.widthIn - (board.offcutWidthIn ?? 0)) * scale;
  return { x1: 0, x2: w, y1: y, y2: y };
}
