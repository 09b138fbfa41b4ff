import { cautionsFor, SAFETY_DEFERENCE, type Tool } from '@/lib/safety/tools';

type Props = {
  tools: readonly Tool[];
  /** Compact: one short list for cards; otherwise grouped under each tool's name. */
  compact?: boolean;
  /** What "Other" stands for, when the segment names it. */
  otherTool?: string;
};

/** The usual cautions for a list of tools, always closed by the line that the maker's manual comes first. */
export function CautionsList({ tools, compact = false, otherTool }: Props) {
  const groups = cautionsFor(tools).filter((g) => g.cautions.length > 0);
  const label = (tool: Tool, fallback: string) => (tool === 'other' && otherTool ? `Other: ${otherTool}` : fallback);
  const deference = <p className={compact ? 'mt-1 text-xs' : 'mt-3 text-sm'}>{SAFETY_DEFERENCE}</p>;

  if (compact) {
    return (
      <div className="text-xs text-attention-ink">
        {groups.length > 0 ? (
          <ul className="list-disc space-y-0.5 pl-4">
            {groups.flatMap((g) => g.cautions.map((c) => <li key={`${g.tool}-${c}`}>{c}</li>))}
          </ul>
        ) : null}
        {deference}
      </div>
    );
  }

  return (
    <div className="rounded-md border-l-4 border-attention bg-attention-soft px-4 py-3 text-attention-ink">
      {groups.length === 0 ? (
        <p className="text-sm">No tools listed, so no tool cautions yet.</p>
      ) : (
        <ul className="space-y-2">
          {groups.map((g) => (
            <li key={g.tool}>
              <p className="text-sm font-bold">{label(g.tool, g.label)}</p>
              <ul className="list-disc pl-5 text-sm">
                {g.cautions.map((c) => (
                  <li key={c}>{c}</li>
                ))}
              </ul>
            </li>
          ))}
        </ul>
      )}
      {deference}
    </div>
  );
}
