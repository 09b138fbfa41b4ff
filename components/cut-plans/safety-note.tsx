/** The usual cautions wherever cuts are shown; the tool maker's manual and local codes come first. */
export function SafetyNote() {
  return (
    <aside aria-label="Shop safety" className="rounded-md border-l-4 border-attention bg-attention-soft px-4 py-3 text-sm text-attention-ink">
      <p className="font-bold">Before you cut</p>
      <ul className="mt-1 list-disc pl-5">
        <li>Follow the saw maker’s instructions; keep guards, riving knife and anti-kickback parts in place.</li>
        <li>Wear eye and hearing protection; use dust collection or a respirator for sanding and sheet goods.</li>
        <li>Use a push stick for narrow rips and support long boards and full sheets on both sides of the blade.</li>
        <li>Never freehand a cut on a table saw; crosscut short parts with a sled or miter gauge, not the fence.</li>
      </ul>
      <p className="mt-1">This plan says where to cut, not how to cut safely: that is the tool maker’s manual, local codes and your training.</p>
    </aside>
  );
}
