import { useId } from 'react';

/**
 * How to take a wheel's inside profile with a straight edge and a depth gauge: a half section of a wheel lying face down,
 * with the readings to take, and the steps in words (the words carry everything the drawing shows).
 */
export function WheelMeasureGuide({ className = '' }: { className?: string }) {
  const id = useId();
  const ink = '#1d4d3a';
  const brass = '#70521a';
  const graphite = '#2b2b28';
  const soft = '#5c5a52';
  // Half section, wheel face down: x = radius from the axle (right), y = depth below the straight edge (down).
  const wheel = '40,120 82,120 96,156 176,161 193,152 200,132 200,0 212,0 212,206 40,206';
  return (
    // Side by side only where the container is wide enough for both; in a narrow column the steps go under the drawing.
    <div className={`@container ${className}`}>
      <figure className="print-break-avoid grid gap-3 @lg:grid-cols-[minmax(0,15rem)_1fr] @lg:items-start">
        <svg
          viewBox="-30 -40 270 262"
          role="img"
          aria-labelledby={`${id}-title`}
          aria-describedby={`${id}-steps`}
          className="h-auto w-full max-w-xs rounded-lg border border-graphite/15 bg-paper-card [print-color-adjust:exact]"
        >
          <title id={`${id}-title`}>Measuring the inside of a wheel lying face down</title>
          <defs>
            <pattern id={`${id}-hatch`} patternUnits="userSpaceOnUse" width="7" height="7" patternTransform="rotate(45)">
              <rect width="7" height="7" fill="#ece6d6" />
              <line x1="0" y1="0" x2="0" y2="7" stroke={soft} strokeWidth="1" />
            </pattern>
            <marker
              id={`${id}-arrow`}
              viewBox="0 0 10 10"
              refX="9"
              refY="5"
              markerWidth="6"
              markerHeight="6"
              orient="auto-start-reverse"
            >
              <path d="M0,0 L10,5 L0,10 z" fill={brass} />
            </marker>
          </defs>
          <polygon points={wheel} fill={`url(#${id}-hatch)`} stroke={graphite} strokeWidth="2" strokeLinejoin="round" />
          {/* axle centre line */}
          <line x1="0" y1="-30" x2="0" y2="215" stroke={soft} strokeWidth="1.2" strokeDasharray="10 4 2 4" />
          <text x="4" y="214" fontSize="11" fill={soft}>
            axle
          </text>
          {/* straight edge across the inboard rim flange */}
          <rect x="-20" y="-7" width="245" height="7" fill={ink} />
          <text x="-20" y="-14" fontSize="12" fontWeight="800" fill={ink}>
            straight edge
          </text>
          {/* depth to the mounting face */}
          <line
            x1="62"
            y1="0"
            x2="62"
            y2="119"
            stroke={brass}
            strokeWidth="2"
            markerStart={`url(#${id}-arrow)`}
            markerEnd={`url(#${id}-arrow)`}
          />
          <text x="44" y="70" fontSize="13" fontWeight="800" fill={brass} textAnchor="end">
            D₀
          </text>
          <text x="46" y="136" fontSize="10" fill={graphite}>
            mounting face
          </text>
          {/* depth and radius of a point on the spokes' back face */}
          <line
            x1="140"
            y1="0"
            x2="140"
            y2="157"
            stroke={brass}
            strokeWidth="2"
            markerStart={`url(#${id}-arrow)`}
            markerEnd={`url(#${id}-arrow)`}
          />
          <text x="146" y="100" fontSize="13" fontWeight="800" fill={brass}>
            D
          </text>
          <line x1="0" y1="20" x2="139" y2="20" stroke={ink} strokeWidth="1.5" markerEnd={`url(#${id}-arrow)`} />
          <text x="70" y="15" fontSize="13" fontWeight="800" fill={ink} textAnchor="middle">
            r
          </text>
          <text x="150" y="178" fontSize="10" fill={graphite} textAnchor="middle">
            spokes’ back face
          </text>
          {/* the barrel's radius at a depth */}
          <line
            x1="0"
            y1="60"
            x2="199"
            y2="60"
            stroke={ink}
            strokeWidth="1.5"
            strokeDasharray="5 3"
            markerEnd={`url(#${id}-arrow)`}
          />
          <text x="196" y="54" fontSize="11" fontWeight="800" fill={ink} textAnchor="end">
            Ø/2 at depth D
          </text>
          <text x="206" y="150" fontSize="10" fill={graphite} textAnchor="end" transform="rotate(-90 206 150)">
            barrel
          </text>
        </svg>
        <figcaption className="text-sm text-graphite">
          <p className="font-bold">Measuring your wheel’s inside</p>
          <ol id={`${id}-steps`} className="mt-1 list-decimal space-y-1 pl-5">
            <li>Lay the wheel face down and put a straight edge across the inboard rim flange, through the centre.</li>
            <li>With a depth gauge, measure from the straight edge down to the mounting face: D₀.</li>
            <li>
              Down the barrel, at a few depths D, measure the inside diameter Ø: enter z = D − D₀ and r = Ø/2. Above the mounting
              face z is negative.
            </li>
            <li>
              Across the spokes’ back face, at a few radii r from the centre, measure the depth D: enter z = D − D₀ and r. Measure
              at the spoke that stands furthest inboard.
            </li>
            <li>
              Take extra points every few millimetres where the barrel turns into the spokes: that fillet is where calipers touch.
            </li>
            <li>
              Enter the points in order from the barrel to the hub. A wheel maker’s clearance template gives the same points.
            </li>
          </ol>
        </figcaption>
      </figure>
    </div>
  );
}
