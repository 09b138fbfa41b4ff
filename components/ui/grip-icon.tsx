/** The six-dot handle drawn on every draggable card and row. */
export function GripIcon({ small = false }: { small?: boolean }) {
  const [w, h, xs, ys] = small ? [14, 18, [4, 10], [3, 9, 15]] as const : [16, 20, [5, 11], [4, 10, 16]] as const;
  return (
    <svg aria-hidden="true" width={w} height={h} viewBox={`0 0 ${w} ${h}`} fill="currentColor">
      {ys.map((y) => (
        <g key={y}>
          {xs.map((x) => (
            <circle key={x} cx={x} cy={y} r="1.6" />
          ))}
        </g>
      ))}
    </svg>
  );
}
