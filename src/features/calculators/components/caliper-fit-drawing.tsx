import { useUnits } from '../../../lib/units';

export type DrawingInput = {
  rotorRadiusMm: number;
  ringInnerRadiusMm: number | null;
  thicknessMm: number | null;
  /** ring centre plane, mm inboard of the hub face; null when the axial figures are missing */
  ringCentreMm: number | null;
  caliperCentreMm: number | null;
  padOuterRadiusMm: number;
  padInnerRadiusMm: number | null;
};

const PAD_THICKNESS_MM = 10;
const MARGIN_MM = 12;

/**
 * A true-scale half section through the corner: the axle runs left (outboard, the wheel side) to right (inboard),
 * radius runs up. Friction ring and hat in ink, pads in brass (red where they hang over the rotor edge), the ring's
 * and the caliper's centre planes as dashed lines.
 */
export function CaliperFitDrawing({ d }: { d: DrawingInput }) {
  const { length } = useUnits();
  const thickness = d.thicknessMm ?? 26;
  const ringCentre = d.ringCentreMm ?? 40;
  const caliperCentre = d.caliperCentreMm ?? ringCentre;
  const padInner = d.padInnerRadiusMm ?? d.padOuterRadiusMm - 45;
  const ringInner = d.ringInnerRadiusMm ?? Math.min(padInner, d.rotorRadiusMm - 50) - 5;
  const outboardFace = ringCentre - thickness / 2;
  const inboardFace = ringCentre + thickness / 2;

  const top = Math.max(d.rotorRadiusMm, d.padOuterRadiusMm) + MARGIN_MM;
  const bottom = Math.min(ringInner, padInner) - 28;
  const left = Math.min(0, outboardFace - PAD_THICKNESS_MM, caliperCentre) - MARGIN_MM;
  const right = Math.max(inboardFace + PAD_THICKNESS_MM, caliperCentre) + MARGIN_MM;
  const width = right - left;
  const height = top - bottom;
  // SVG y grows downward; radius grows upward.
  const y = (r: number) => top - r;
  const x = (a: number) => a - left;
  const stroke = Math.max(width, height) / 260;

  const hat =
    d.ringCentreMm === null
      ? null
      : [
          [0, bottom + 4],
          [0, ringInner],
          [outboardFace, ringInner],
          [outboardFace, ringInner - 4],
          [4, ringInner - 4],
          [4, bottom + 4],
        ];
  const overhang = d.padOuterRadiusMm > d.rotorRadiusMm;
  const padTop = d.padOuterRadiusMm;
  const padHeight = padTop - padInner;
  const offset = caliperCentre - ringCentre;

  const summary = [
    overhang
      ? `The pad reaches ${length(d.padOuterRadiusMm - d.rotorRadiusMm, 1)} past the rotor edge.`
      : `The pad's outer edge sits ${length(d.rotorRadiusMm - d.padOuterRadiusMm, 1)} inside the rotor edge.`,
    d.ringCentreMm !== null && d.caliperCentreMm !== null
      ? Math.abs(offset) < 0.005
        ? 'The caliper centre plane lies on the ring centre plane.'
        : `The caliper centre plane lies ${length(Math.abs(offset), 2)} ${offset > 0 ? 'inboard' : 'outboard'} of the ring centre plane.`
      : 'Axial positions not given: the planes are not drawn.',
  ].join(' ');

  return (
    <figure className="rounded-lg border border-graphite/15 bg-paper p-2" data-caliper-drawing>
      <svg
        viewBox={`0 0 ${width} ${height}`}
        className="mx-auto block h-56 w-full max-w-md"
        role="img"
        aria-label={`Section of the pad on the rotor. ${summary}`}
      >
        <title>Section of the pad on the rotor</title>
        {hat && (
          <polygon
            points={hat.map(([a, r]) => `${x(a)},${y(r)}`).join(' ')}
            className="fill-ink/15 stroke-ink"
            strokeWidth={stroke}
          />
        )}
        <rect
          x={x(outboardFace)}
          y={y(d.rotorRadiusMm)}
          width={thickness}
          height={d.rotorRadiusMm - ringInner}
          className="fill-ink/25 stroke-ink"
          strokeWidth={stroke}
        />
        {[outboardFace - PAD_THICKNESS_MM, inboardFace].map((a) => (
          <g key={a}>
            <rect
              x={x(a)}
              y={y(padTop)}
              width={PAD_THICKNESS_MM}
              height={padHeight}
              className="fill-brass/60 stroke-brass-deep"
              strokeWidth={stroke}
            />
            {overhang && (
              <rect x={x(a)} y={y(padTop)} width={PAD_THICKNESS_MM} height={padTop - d.rotorRadiusMm} className="fill-oxide/70" />
            )}
          </g>
        ))}
        <line
          x1={x(left + 2)}
          x2={x(right - 2)}
          y1={y(d.rotorRadiusMm)}
          y2={y(d.rotorRadiusMm)}
          className="stroke-graphite/40"
          strokeWidth={stroke / 2}
          strokeDasharray={`${stroke * 3} ${stroke * 2}`}
        />
        {d.ringCentreMm !== null && (
          <line
            x1={x(ringCentre)}
            x2={x(ringCentre)}
            y1={y(top - 2)}
            y2={y(bottom + 2)}
            className="stroke-ink"
            strokeWidth={stroke}
            strokeDasharray={`${stroke * 4} ${stroke * 2}`}
          />
        )}
        {d.caliperCentreMm !== null && (
          <line
            x1={x(caliperCentre)}
            x2={x(caliperCentre)}
            y1={y(top - 2)}
            y2={y(bottom + 2)}
            className="stroke-brass-deep"
            strokeWidth={stroke}
            strokeDasharray={`${stroke} ${stroke * 2}`}
          />
        )}
      </svg>
      <figcaption className="mt-1 text-xs text-graphite-soft">
        <span className="font-semibold text-graphite">Section, true to scale</span> — wheel side left, car side right. Friction
        ring and hat in green, pads in brass{overhang ? ', the part past the rotor edge in red' : ''}; dashed: rotor edge (grey),
        ring centre plane (green), caliper centre plane (brass). {summary}
      </figcaption>
    </figure>
  );
}
