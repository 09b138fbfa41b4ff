/** One figure in a <dl> of figures (cost, board feet, waste…): a small label over a monospaced value. */
export function Stat({ label, value }: { label: string; value: string }) {
  return (
    <div className="rounded-md bg-paper-deep/70 px-3 py-2">
      <dt className="text-xs text-ink-faint">{label}</dt>
      <dd className="font-mono text-base">{value}</dd>
    </div>
  );
}
