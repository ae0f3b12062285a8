import type { StripGeometry } from "../strip-geometry";

type OutlineBand = { index: number; start: number; end: number };

type BandOutlinesProps = {
  geometry: StripGeometry;
  bands: OutlineBand[];
  /** The photo's size in pixels (any unit works, as long as the shape is right). */
  width: number;
  height: number;
};

/**
 * Each band outlined on the photo: a rectangle turned along the strip's axis, between the band's
 * start and end fractions. Drawn twice (light under dark) so it shows on any colour.
 */
export function BandOutlines({ geometry, bands, width, height }: BandOutlinesProps) {
  const sx = geometry.start.x * width;
  const sy = geometry.start.y * height;
  const dx = geometry.end.x * width - sx;
  const dy = geometry.end.y * height - sy;
  const length = Math.hypot(dx, dy);
  const angle = (Math.atan2(dy, dx) * 180) / Math.PI;
  const thickness = geometry.thickness * Math.max(width, height);
  const line = Math.max(2, Math.max(width, height) / 400);
  const label = Math.max(10, thickness * 0.28);

  return (
    <svg
      viewBox={`0 0 ${width} ${height}`}
      aria-hidden="true"
      className="pointer-events-none absolute inset-0 h-full w-full"
      data-testid="band-outlines"
    >
      {bands.map((band) => {
        const mid = (band.start + band.end) / 2;
        const cx = sx + dx * mid;
        const cy = sy + dy * mid;
        const w = Math.max(0, (band.end - band.start) * length);
        const h = thickness;
        return (
          <g key={band.index} transform={`translate(${cx} ${cy}) rotate(${angle})`}>
            <rect x={-w / 2} y={-h / 2} width={w} height={h} fill="none" stroke="#fffefb" strokeWidth={line * 2.5} rx={line} />
            <rect x={-w / 2} y={-h / 2} width={w} height={h} fill="none" stroke="#1c2130" strokeWidth={line} rx={line} />
            <g transform={`rotate(${-angle})`}>
              <circle r={label * 0.75} fill="#fffefb" stroke="#1c2130" strokeWidth={line / 2} />
              <text textAnchor="middle" dominantBaseline="central" fontSize={label} fontWeight={700} fill="#1c2130">
                {band.index + 1}
              </text>
            </g>
          </g>
        );
      })}
    </svg>
  );
}
