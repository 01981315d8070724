import { useId } from 'react';
import { FitmentInputError } from '@shared/fitment/errors';
import { MIN_CLEARANCE_MM } from '@shared/fitment/clearance';
import { closestOnSegment, closedEdges } from '@shared/fitment/plane-geometry';
import { sectionClearance, type SectionPoint, type SectionResult } from '@shared/fitment/section';
import { useUnits } from '../lib/units';

export type SectionDrawingProps = {
  /** the caliper outline as recorded (hub frame, before any rotor growth) */
  caliper: SectionPoint[];
  /** the wheel's inside as recorded (wheel frame, before any spacer) */
  wheel: SectionPoint[];
  spacerMm?: number;
  rotorGrowthMm?: number;
  /** the rotor's diameter the outline was recorded with; its edge is drawn (moved out by the growth) */
  rotorDiameterMm?: number;
  /** drawn from the two legacy numbers: says so, and shows the figure without pass/fail colours */
  estimate?: boolean;
  /** the clearance the nearest point is held to; default 3 mm (common practice) */
  minClearanceMm?: number;
  title?: string;
  className?: string;
};

type Part = 'barrel' | 'fillet' | 'spokes';

/** Which part of the wheel a stretch of its inside belongs to, by its slope: along the axle, across it, or between. */
function partOf(a: SectionPoint, b: SectionPoint): Part {
  const dz = Math.abs(b.zMm - a.zMm);
  const dr = Math.abs(b.rMm - a.rMm);
  if (dr <= dz * 0.25) return 'barrel';
  if (dz <= dr * 0.25) return 'spokes';
  return 'fillet';
}

function partAt(wheel: SectionPoint[], at: SectionPoint): Part {
  let best: { part: Part; d: number } = { part: 'barrel', d: Infinity };
  for (let i = 1; i < wheel.length; i++) {
    const a = { x: wheel[i - 1].zMm, y: wheel[i - 1].rMm };
    const b = { x: wheel[i].zMm, y: wheel[i].rMm };
    const q = closestOnSegment({ x: at.zMm, y: at.rMm }, a, b);
    const d = Math.hypot(q.x - at.zMm, q.y - at.rMm);
    if (d < best.d) best = { part: partOf(wheel[i - 1], wheel[i]), d };
  }
  // Beyond the recorded ends the check continues the barrel inboard and the spoke face to the axle.
  if (best.d > 1e-6) {
    const first = wheel[0];
    return Math.abs(at.rMm - first.rMm) < 1e-6 && at.zMm <= first.zMm ? 'barrel' : 'spokes';
  }
  return best.part;
}

const partWords: Record<Part, string> = { barrel: 'the barrel', fillet: 'the fillet', spokes: 'the spokes' };

function compute(props: SectionDrawingProps): SectionResult | null {
  try {
    return sectionClearance({
      caliper: props.caliper,
      wheel: props.wheel,
      spacerMm: props.spacerMm,
      rotorGrowthMm: props.rotorGrowthMm,
    });
  } catch (error) {
    if (error instanceof FitmentInputError) return null;
    throw error;
  }
}

/**
 * The section through the axle: the wheel's inside (barrel, fillet, spokes) with the wheel shaded beyond it, the caliper
 * outline, the rotor edge and the nearest point with its clearance. z runs left to right (outboard to the right),
 * the radius upward. The caption below says the same in words.
 */
export function SectionDrawing(props: SectionDrawingProps) {
  const { spacerMm = 0, rotorGrowthMm = 0, rotorDiameterMm, estimate = false, minClearanceMm = MIN_CLEARANCE_MM } = props;
  const { length, lengthToward } = useUnits();
  const id = useId();
  const result = compute(props);
  const title = props.title ?? 'Section through the axle';
  if (!result) {
    return (
      <p className={`rounded-lg border border-dashed border-graphite/25 p-3 text-sm text-graphite-soft ${props.className ?? ''}`}>
        The drawing needs at least three caliper points and two wheel points.
      </p>
    );
  }

  const caliper = props.caliper.map((p) => ({ zMm: p.zMm, rMm: p.rMm + rotorGrowthMm }));
  let wheel = props.wheel.map((p) => ({ zMm: p.zMm + spacerMm, rMm: p.rMm }));
  if (wheel[wheel.length - 1].rMm - wheel[0].rMm > 1e-6) wheel = [...wheel].reverse();
  const at = result.at;
  const onCaliper = nearestOnOutline(caliper, at);
  const rotorEdge = rotorDiameterMm !== undefined ? rotorDiameterMm / 2 + rotorGrowthMm : null;

  // The view: the caliper and the nearest point, with the wheel around them.
  const calZ = caliper.map((p) => p.zMm);
  const calR = caliper.map((p) => p.rMm);
  const near = (p: SectionPoint) =>
    p.zMm > Math.min(...calZ) - 60 &&
    p.zMm < Math.max(...calZ) + 60 &&
    p.rMm > Math.min(...calR) - 60 &&
    p.rMm < Math.max(...calR) + 60;
  const shown = [...caliper, at, ...wheel.filter(near)];
  const zs = shown.map((p) => p.zMm);
  const rs = shown.map((p) => p.rMm);
  const span = Math.max(Math.max(...zs) - Math.min(...zs), Math.max(...rs) - Math.min(...rs), 40);
  const pad = span * 0.16;
  const left = Math.min(...zs) - pad;
  const right = Math.max(...zs) + pad;
  const bottom = Math.min(...rs) - pad;
  const top = Math.max(...rs) + pad * 1.2;
  const width = right - left;
  const height = top - bottom;
  const font = Math.max(width, height * 0.8) * 0.036;
  const stroke = font * 0.14;

  // SVG y grows downward: y = −r.
  const xy = (p: SectionPoint) => `${p.zMm},${-p.rMm}`;
  const farLeft = left - width;
  const farRight = right + width;
  const farTop = top + height;
  const farBottom = bottom - height;
  const first = wheel[0];
  const last = wheel[wheel.length - 1];
  const surface = [{ zMm: farLeft, rMm: first.rMm }, ...wheel, { zMm: last.zMm, rMm: Math.max(0, farBottom) }];
  const material = [...surface, { zMm: farRight, rMm: farBottom }, { zMm: farRight, rMm: farTop }, { zMm: farLeft, rMm: farTop }];

  const ok = !result.interferes && result.clearanceMm >= minClearanceMm - 1e-9;
  const tone = estimate ? '#70521a' : ok ? '#1d4d3a' : '#a4372a';
  // Clearances are rounded down, overlaps up: the figure never flatters.
  const figure = `${estimate ? '≈ ' : ''}${
    result.interferes ? `${lengthToward(-result.clearanceMm, 'up')} overlap` : lengthToward(result.clearanceMm, 'down')
  }`;
  const part = partAt(wheel, at);
  const labels = partLabels(wheel, { left, right, bottom, top }, font);

  const words = [
    result.interferes
      ? `The caliper overlaps ${partWords[part]} by ${lengthToward(-result.clearanceMm, 'up')}.`
      : `Nearest point: ${lengthToward(result.clearanceMm, 'down')} between the caliper and ${partWords[part]}.`,
    `It lies ${describeZ(at.zMm, length)} and ${length(at.rMm, 0)} from the axle centre.`,
    spacerMm > 0 ? `With a ${length(spacerMm, 1)} spacer.` : 'Without a spacer.',
    rotorGrowthMm !== 0
      ? `Rotor radius ${rotorGrowthMm > 0 ? 'grown' : 'reduced'} by ${length(Math.abs(rotorGrowthMm), 1)}.`
      : '',
    estimate ? 'An estimate from two recorded numbers: the caliper drawn as a box, the wheel as a square corner.' : '',
  ]
    .filter(Boolean)
    .join(' ');

  const labelAnchorX = (at.zMm + onCaliper.zMm) / 2;
  const labelAnchorY = -(at.rMm + onCaliper.rMm) / 2;
  // The clearance label sits inboard-below the nearest point, inside the free space, kept inside the view.
  const labelX = Math.min(right - font * 4, Math.max(left + font * 4, labelAnchorX - font * 2.5));
  const labelY = Math.min(-bottom - font, Math.max(-top + font * 2, labelAnchorY + font * 2.6));

  return (
    <figure
      className={`print-break-avoid print:mx-auto print:max-w-[130mm] ${props.className ?? ''}`}
      data-section-drawing
      data-clearance={result.clearanceMm.toFixed(3)}
    >
      <svg
        viewBox={`${left} ${-top} ${width} ${height}`}
        role="img"
        aria-labelledby={`${id}-title`}
        aria-describedby={`${id}-caption`}
        className="h-auto w-full rounded-lg border border-graphite/15 bg-paper-card [print-color-adjust:exact]"
        style={{ fontFamily: 'inherit' }}
      >
        <title id={`${id}-title`}>{title}</title>
        <defs>
          <pattern
            id={`${id}-hatch`}
            patternUnits="userSpaceOnUse"
            width={font * 0.8}
            height={font * 0.8}
            patternTransform="rotate(45)"
          >
            <rect width={font * 0.8} height={font * 0.8} fill="#ece6d6" />
            <line x1="0" y1="0" x2="0" y2={font * 0.8} stroke="#5c5a52" strokeWidth={stroke * 0.8} />
          </pattern>
          <clipPath id={`${id}-material`}>
            <polygon points={material.map(xy).join(' ')} />
          </clipPath>
        </defs>

        {/* the wheel, shaded beyond its inside */}
        <polygon points={material.map(xy).join(' ')} fill={`url(#${id}-hatch)`} />
        <polyline
          points={wheel.map(xy).join(' ')}
          fill="none"
          stroke="#2b2b28"
          strokeWidth={stroke * 2.2}
          strokeLinejoin="round"
        />
        <polyline
          points={[{ zMm: farLeft, rMm: first.rMm }, first].map(xy).join(' ')}
          fill="none"
          stroke="#2b2b28"
          strokeWidth={stroke * 1.2}
          strokeDasharray={`${font * 0.5} ${font * 0.35}`}
        />
        <polyline
          points={[last, { zMm: last.zMm, rMm: Math.max(0, farBottom) }].map(xy).join(' ')}
          fill="none"
          stroke="#2b2b28"
          strokeWidth={stroke * 1.2}
          strokeDasharray={`${font * 0.5} ${font * 0.35}`}
        />

        {/* hub mounting face */}
        {left < 0 && right > 0 && (
          <g>
            <line
              x1={0}
              x2={0}
              y1={-top}
              y2={-bottom}
              stroke="#5c5a52"
              strokeWidth={stroke}
              strokeDasharray={`${font * 0.2} ${font * 0.3}`}
            />
            <text x={font * 0.3} y={-bottom - font * 0.5} fontSize={font * 0.8} fill="#5c5a52">
              hub face
            </text>
          </g>
        )}

        {/* the caliper, with any overlap with the wheel in red */}
        <polygon
          points={caliper.map(xy).join(' ')}
          fill="#e9d7ad"
          fillOpacity={0.85}
          stroke="#70521a"
          strokeWidth={stroke * 1.6}
          strokeLinejoin="round"
        />
        {result.interferes && (
          <polygon points={caliper.map(xy).join(' ')} fill="#a4372a" fillOpacity={0.75} clipPath={`url(#${id}-material)`} />
        )}
        <text
          x={(Math.min(...calZ) + Math.max(...calZ)) / 2}
          y={-(Math.min(...calR) + Math.max(...calR)) / 2 + font * 0.35}
          fontSize={font}
          fontWeight={800}
          fill="#70521a"
          textAnchor="middle"
        >
          caliper
        </text>

        {/* rotor edge */}
        {rotorEdge !== null && rotorEdge > bottom && rotorEdge < top && (
          <g>
            <line
              x1={Math.min(...calZ) - font}
              x2={Math.max(...calZ) + font}
              y1={-rotorEdge}
              y2={-rotorEdge}
              stroke="#1d4d3a"
              strokeWidth={stroke * 1.4}
              strokeDasharray={`${font * 0.8} ${font * 0.3} ${font * 0.15} ${font * 0.3}`}
            />
            <text x={Math.min(...calZ) + font * 0.5} y={-rotorEdge + font * 1.1} fontSize={font * 0.8} fill="#1d4d3a">
              rotor edge
            </text>
          </g>
        )}

        {labels.map((l) => (
          <text
            key={l.text}
            x={l.x}
            y={l.y}
            fontSize={font}
            fontWeight={800}
            fill="#2b2b28"
            textAnchor={l.anchor}
            transform={l.rotate ? `rotate(${l.rotate} ${l.x} ${l.y})` : undefined}
          >
            <tspan style={{ paintOrder: 'stroke' }} stroke="#fffdf8" strokeWidth={stroke * 3}>
              {l.text}
            </tspan>
          </text>
        ))}

        {/* the nearest point and its clearance */}
        {!result.interferes && result.clearanceMm > 0 && (
          <line x1={onCaliper.zMm} y1={-onCaliper.rMm} x2={at.zMm} y2={-at.rMm} stroke={tone} strokeWidth={stroke * 1.4} />
        )}
        <circle cx={at.zMm} cy={-at.rMm} r={font * 0.35} fill="#fffdf8" stroke={tone} strokeWidth={stroke * 2} />
        <line x1={labelAnchorX} y1={labelAnchorY} x2={labelX} y2={labelY - font * 0.9} stroke={tone} strokeWidth={stroke} />
        <text x={labelX} y={labelY} fontSize={font * 1.15} fontWeight={800} fill={tone} textAnchor="middle">
          <tspan style={{ paintOrder: 'stroke' }} stroke="#fffdf8" strokeWidth={stroke * 3}>
            {figure}
          </tspan>
        </text>

        {/* directions */}
        <text x={left + font * 0.4} y={-bottom - font * 0.5} fontSize={font * 0.75} fill="#5c5a52">
          outboard → · ↑ from the axle
        </text>
      </svg>
      <figcaption id={`${id}-caption`} className="mt-2 text-sm text-graphite print:mt-1 print:text-[7pt] print:leading-tight">
        {words}
      </figcaption>
    </figure>
  );
}

function nearestOnOutline(outline: SectionPoint[], p: SectionPoint): SectionPoint {
  const v = outline.map((q) => ({ x: q.zMm, y: q.rMm }));
  let best = { d: Infinity, q: v[0] };
  for (const [a, b] of closedEdges(v)) {
    const q = closestOnSegment({ x: p.zMm, y: p.rMm }, a, b);
    const d = Math.hypot(q.x - p.zMm, q.y - p.rMm);
    if (d < best.d) best = { d, q };
  }
  return { zMm: best.q.x, rMm: best.q.y };
}

function describeZ(z: number, length: (mm: number, digits?: number) => string): string {
  if (Math.abs(z) < 0.05) return 'at the hub face';
  return `${length(Math.abs(z), 0)} ${z > 0 ? 'outboard' : 'inboard'} of the hub face`;
}

type View = { left: number; right: number; bottom: number; top: number };

/** "barrel", "fillet" and "spokes" beside the longest visible stretch of each, on the wheel's side. */
function partLabels(wheel: SectionPoint[], view: View, font: number) {
  const inView = (p: SectionPoint) => p.zMm > view.left && p.zMm < view.right && p.rMm > view.bottom && p.rMm < view.top;
  const clip = (p: SectionPoint): SectionPoint => ({
    zMm: Math.min(view.right - font * 3, Math.max(view.left + font * 3, p.zMm)),
    rMm: Math.min(view.top - font, Math.max(view.bottom + font * 1.5, p.rMm)),
  });
  const best = new Map<Part, { a: SectionPoint; b: SectionPoint; length: number }>();
  for (let i = 1; i < wheel.length; i++) {
    const [a, b] = [clip(wheel[i - 1]), clip(wheel[i])];
    if (!inView(wheel[i - 1]) && !inView(wheel[i]) && Math.hypot(a.zMm - b.zMm, a.rMm - b.rMm) < font) continue;
    const part = partOf(wheel[i - 1], wheel[i]);
    const length = Math.hypot(a.zMm - b.zMm, a.rMm - b.rMm);
    if (length > (best.get(part)?.length ?? 0)) best.set(part, { a, b, length });
  }
  const out: { text: string; x: number; y: number; anchor: 'start' | 'middle' | 'end'; rotate?: number }[] = [];
  const barrel = best.get('barrel');
  if (barrel)
    out.push({
      text: 'barrel',
      x: (barrel.a.zMm + barrel.b.zMm) / 2,
      y: -Math.max(barrel.a.rMm, barrel.b.rMm) - font * 0.7,
      anchor: 'middle',
    });
  const spokes = best.get('spokes');
  if (spokes)
    out.push({
      text: 'spokes',
      x: Math.max(spokes.a.zMm, spokes.b.zMm) + font * 1.1,
      y: -(spokes.a.rMm + spokes.b.rMm) / 2,
      anchor: 'middle',
      // along the spoke face, on the wheel's side of it
      rotate: 90,
    });
  const fillet = best.get('fillet');
  if (fillet) {
    out.push({
      text: 'fillet',
      x: Math.max(fillet.a.zMm, fillet.b.zMm) + font * 0.4,
      y: -Math.max(fillet.a.rMm, fillet.b.rMm) - font * 0.4,
      anchor: 'start',
    });
  }
  return out;
}
