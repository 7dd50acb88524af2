/** The Sixfold mark: three seat points and their normals meeting at a part, drawn in thin lines. */
export function Mark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" className="text-teal">
      <circle cx="16" cy="16" r="13" fill="none" stroke="currentColor" strokeWidth="1.2" />
      {[90, 210, 330].map((deg) => {
        const r = (deg * Math.PI) / 180;
        const x = 16 + 13 * Math.cos(r);
        const y = 16 - 13 * Math.sin(r);
        const x2 = 16 + 6 * Math.cos(r);
        const y2 = 16 - 6 * Math.sin(r);
        return (
          <g key={deg}>
            <line x1={x} y1={y} x2={x2} y2={y2} stroke="currentColor" strokeWidth="1.2" />
            <circle cx={x} cy={y} r="2.2" fill="currentColor" />
          </g>
        );
      })}
      <circle cx="16" cy="16" r="1.6" fill="currentColor" />
    </svg>
  );
}
