import { FitmentInputError, requireFinite, requireNonNegative, requirePositive } from './errors';
import {
  EPS,
  along,
  closedEdges,
  closestOnSegment,
  distance,
  lineNearSegment,
  openEdges,
  pointInPolygon,
  roots,
  segmentGap,
  type Vec,
} from './plane-geometry';

/**
 * The section check: the caliper's outline against the inside of the wheel, in the plane through the axle.
 * z = axial distance from the hub's wheel-mounting face, positive outboard; r = radius from the axle; millimetres.
 * Distances are plane geometry (point-to-segment and segment-to-segment distance), exact to rounding.
 */

export interface SectionPoint {
  zMm: number;
  rMm: number;
}

export interface SectionInput {
  /** closed polygon: the caliper's silhouette swept around the axle, in the hub's frame */
  caliper: SectionPoint[];
  /** open polyline: the wheel's inside (barrel, fillet, spokes' back face), in the wheel's frame (its mounting face at z = 0) */
  wheel: SectionPoint[];
  /** moves the wheel outboard (+z) by its thickness */
  spacerMm?: number;
  /** growth of the rotor's radius; moves a radially mounted caliper outward (+r) by as much */
  rotorGrowthMm?: number;
}

export interface SectionResult {
  /** the smallest gap between caliper and wheel; negative when they overlap: how far the caliper reaches past the wheel */
  clearanceMm: number;
  interferes: boolean;
  /** the nearest point on the wheel (where the caliper reaches deepest when they overlap), in the hub's frame */
  at: SectionPoint;
}

export const SECTION_CLEARANCE_RULE =
  'At least 3 mm (about 1/8 in) between the caliper outline and the inside of the wheel, at its nearest point (common practice)';

/**
 * The measured inside is taken to run on past its ends — the barrel straight inboard at its first radius, the spoke face
 * straight down to the axle at its last z — so a short record never lets the caliper slip past an unmeasured part of the
 * wheel (it errs toward less clearance). `EXTENT` stands in for "straight on"; a spacer search stops well before it.
 */
const EXTENT = 1e6;
const SPACER_SEARCH_LIMIT_MM = 1000;
const ORDER_TOLERANCE_MM = 1e-6;

const toPoint = (v: Vec): SectionPoint => ({ zMm: v.x, rMm: v.y });

function readPoints(points: unknown, field: 'caliper' | 'wheel', least: number): Vec[] {
  if (!Array.isArray(points) || points.length < least) {
    const what = field === 'caliper' ? 'the caliper outline' : 'the wheel inside';
    throw new FitmentInputError(
      field,
      `${field} needs at least ${least} points for ${what} (got ${Array.isArray(points) ? points.length : 0})`,
    );
  }
  return points.map((p: Partial<SectionPoint> | null, i) => {
    const z = requireFinite(p?.zMm, `${field}.${i}.zMm`);
    const r = requireNonNegative(p?.rMm, `${field}.${i}.rMm`);
    return { x: z, y: r };
  });
}

interface Prepared {
  caliper: Vec[];
  /** the recorded wheel points, spacer applied, barrel end first */
  wheel: Vec[];
  /** the wheel with its straight-on continuations: what distances are measured to */
  surface: Vec[];
  /** the free side of the surface (inboard and toward the axle), closed far away */
  free: Vec[];
}

function prepare(input: SectionInput): Prepared {
  const caliperPoints = readPoints(input?.caliper, 'caliper', 3);
  let wheelPoints = readPoints(input.wheel, 'wheel', 2);
  const spacer = requireNonNegative(input.spacerMm ?? 0, 'spacerMm');
  const growth = requireFinite(input.rotorGrowthMm ?? 0, 'rotorGrowthMm');

  // Recorded either way round: the end at the clearly larger radius is the barrel.
  if (wheelPoints[wheelPoints.length - 1].y - wheelPoints[0].y > ORDER_TOLERANCE_MM) wheelPoints = [...wheelPoints].reverse();
  const caliper = caliperPoints.map((p) => ({ x: p.x, y: p.y + growth }));
  const wheel = wheelPoints.map((p) => ({ x: p.x + spacer, y: p.y }));
  return { caliper, wheel, ...surfaceOf(wheel, caliper) };
}

function surfaceOf(wheel: Vec[], caliper: Vec[]): Pick<Prepared, 'surface' | 'free'> {
  const first = wheel[0];
  const last = wheel[wheel.length - 1];
  const far = Math.min(...wheel.map((p) => p.x), ...caliper.map((p) => p.x)) - EXTENT;
  const surface = [{ x: far, y: first.y }, ...wheel, ...(last.y > 0 ? [{ x: last.x, y: 0 }] : [])];
  const free = [...surface, { x: last.x, y: -EXTENT }, { x: far, y: -EXTENT }];
  return { surface, free };
}

interface Nearest {
  distance: number;
  onCaliper: Vec;
  onWheel: Vec;
}

function nearestApproach(caliper: Vec[], surface: Vec[]): Nearest {
  let best: Nearest = { distance: Infinity, onCaliper: caliper[0], onWheel: surface[0] };
  for (const [a, b] of closedEdges(caliper)) {
    for (const [c, d] of openEdges(surface)) {
      const gap = segmentGap(a, b, c, d);
      if (gap.distance < best.distance) best = { distance: gap.distance, onCaliper: gap.onFirst, onWheel: gap.onSecond };
    }
  }
  return best;
}

function nearestOnSurface(p: Vec, surface: Vec[]): { distance: number; point: Vec } {
  let best = { distance: Infinity, point: surface[0] };
  for (const [a, b] of openEdges(surface)) {
    const point = closestOnSegment(p, a, b);
    const d = distance(p, point);
    if (d < best.distance) best = { distance: d, point };
  }
  return best;
}

/**
 * Where the caliper's outline reaches deepest past the wheel's surface, walking each caliper edge.
 * Along an edge the depth is the least of a few convex functions (distance to each surface vertex, to each surface line),
 * so its largest value sits at an edge end or where the nearest feature changes: where two of them are equally far,
 * where a foot leaves a segment, or where the edge crosses the surface. Those parameters are solved exactly.
 */
function deepestReach(prepared: Prepared): { depth: number; at: Vec } {
  const { caliper, surface, free } = prepared;
  const lines = openEdges(surface)
    .map(([a, b]) => {
      const d = { x: b.x - a.x, y: b.y - a.y };
      const length = Math.hypot(d.x, d.y);
      return { a, d, length, n: { x: -d.y / length, y: d.x / length } };
    })
    .filter((l) => l.length > 0);
  let best = { depth: 0, at: surface[0] };

  for (const [p, q] of closedEdges(caliper)) {
    const e = { x: q.x - p.x, y: q.y - p.y };
    const ee = e.x * e.x + e.y * e.y;
    const ts = [0, 1];
    const lineTerms = lines.map((l) => {
      const pa = { x: p.x - l.a.x, y: p.y - l.a.y };
      return {
        ...l,
        alpha: l.n.x * pa.x + l.n.y * pa.y,
        beta: l.n.x * e.x + l.n.y * e.y,
        foot0: pa.x * l.d.x + pa.y * l.d.y,
        foot1: e.x * l.d.x + e.y * l.d.y,
      };
    });
    const vertexTerms = surface.map((v) => {
      const pv = { x: p.x - v.x, y: p.y - v.y };
      return { v, b: 2 * (e.x * pv.x + e.y * pv.y), c: pv.x * pv.x + pv.y * pv.y };
    });
    for (const l of lineTerms) {
      ts.push(...roots(0, l.beta, l.alpha)); // crossing the line
      ts.push(...roots(0, l.foot1, l.foot0), ...roots(0, l.foot1, l.foot0 - l.length * l.length)); // foot at either end
    }
    for (let i = 0; i < lineTerms.length; i++) {
      for (let j = i + 1; j < lineTerms.length; j++) {
        const [l, m] = [lineTerms[i], lineTerms[j]];
        ts.push(...roots(0, l.beta - m.beta, l.alpha - m.alpha), ...roots(0, l.beta + m.beta, l.alpha + m.alpha));
      }
      for (const v of vertexTerms) {
        const l = lineTerms[i];
        ts.push(...roots(ee - l.beta * l.beta, v.b - 2 * l.alpha * l.beta, v.c - l.alpha * l.alpha));
      }
    }
    for (let i = 0; i < vertexTerms.length; i++) {
      for (let j = i + 1; j < vertexTerms.length; j++) {
        ts.push(...roots(0, vertexTerms[i].b - vertexTerms[j].b, vertexTerms[i].c - vertexTerms[j].c));
      }
    }
    for (const t of ts) {
      if (!(t >= -EPS && t <= 1 + EPS)) continue;
      const x = along(p, q, Math.min(1, Math.max(0, t)));
      if (pointInPolygon(x, free)) continue;
      const near = nearestOnSurface(x, surface);
      if (near.distance > best.depth) best = { depth: near.distance, at: near.point };
    }
  }

  return best;
}

export function sectionClearance(input: SectionInput): SectionResult {
  const prepared = prepare(input);
  const nearest = nearestApproach(prepared.caliper, prepared.surface);
  if (nearest.distance > EPS && pointInPolygon(prepared.caliper[0], prepared.free)) {
    return { clearanceMm: nearest.distance, interferes: false, at: toPoint(nearest.onWheel) };
  }
  const deepest = deepestReach(prepared);
  if (deepest.depth > EPS) return { clearanceMm: -deepest.depth, interferes: true, at: toPoint(deepest.at) };
  return { clearanceMm: nearest.distance, interferes: false, at: toPoint(nearest.onWheel) };
}

type Interval = [number, number];

/**
 * The values of s for which the caliper moved by s·v comes closer than `radius` to the wheel. For one caliper edge and one
 * wheel segment the distance is convex in s (the distance from a moving point to their Minkowski difference), so the
 * too-close values form one open interval; it is spanned by where an endpoint of either comes within `radius` of the other.
 */
function blockedIntervals(prepared: Prepared, v: Vec, radius: number): Interval[] {
  const back = { x: -v.x, y: -v.y };
  const intervals: Interval[] = [];
  for (const [c0, c1] of closedEdges(prepared.caliper)) {
    for (const [w0, w1] of openEdges(prepared.surface)) {
      let lo = Infinity;
      let hi = -Infinity;
      const spans = [
        lineNearSegment(c0, v, w0, w1, radius),
        lineNearSegment(c1, v, w0, w1, radius),
        lineNearSegment(w0, back, c0, c1, radius),
        lineNearSegment(w1, back, c0, c1, radius),
      ];
      for (const span of spans) {
        if (!span) continue;
        lo = Math.min(lo, span[0]);
        hi = Math.max(hi, span[1]);
      }
      if (lo < hi) intervals.push([lo, hi]);
    }
  }
  intervals.sort((a, b) => a[0] - b[0]);
  const merged: Interval[] = [];
  for (const next of intervals) {
    const last = merged[merged.length - 1];
    if (last && next[0] < last[1]) last[1] = Math.max(last[1], next[1]);
    else merged.push([...next]);
  }
  return merged;
}

/** Whether the caliper moved by s·v is clear of the wheel by at least the radius the intervals were built for. */
function clearAt(prepared: Prepared, blocked: Interval[], v: Vec, s: number): boolean {
  if (blocked.some(([lo, hi]) => lo < s && s < hi)) return false;
  // Not touching anywhere, so the whole outline is on one side: test one corner.
  const corner = prepared.caliper[0];
  return pointInPolygon({ x: corner.x + s * v.x, y: corner.y + s * v.y }, prepared.free);
}

function readTarget(targetMm: number): number {
  return requireNonNegative(targetMm, 'targetMm');
}

/**
 * The thinnest spacer (mm, from none up) that gives at least `targetMm` of clearance, or null when no spacer can:
 * moving the wheel outboard does nothing for the barrel, which then governs. Any spacer in `input` is replaced by the search.
 */
export function minSpacerForClearance(input: SectionInput, targetMm: number): number | null {
  const target = readTarget(targetMm);
  const prepared = prepare({ ...input, spacerMm: 0 });
  // A spacer t moves the wheel +t in z: relative to the wheel the caliper moves −t.
  const v = { x: -1, y: 0 };
  const blocked = blockedIntervals(prepared, v, Math.max(target, EPS));
  const candidates = [0, ...blocked.map(([, hi]) => hi)].filter((s) => s >= 0).sort((a, b) => a - b);
  for (const s of candidates) {
    if (s > SPACER_SEARCH_LIMIT_MM) return null;
    if (clearAt(prepared, blocked, v, s)) return s;
  }
  return null;
}

/**
 * The largest growth of the rotor's radius (mm) that keeps at least `targetMm` of clearance, growing from the outline as
 * recorded; negative when the recorded outline already fails and a smaller rotor is needed; null when no rotor size keeps
 * the target (the spokes govern). Any growth in `input` is replaced by the search; its spacer is kept.
 */
export function maxRotorGrowthForClearance(input: SectionInput, targetMm: number): number | null {
  const target = readTarget(targetMm);
  const prepared = prepare({ ...input, rotorGrowthMm: 0 });
  const v = { x: 0, y: 1 };
  const blocked = blockedIntervals(prepared, v, Math.max(target, EPS));
  if (clearAt(prepared, blocked, v, 0)) {
    const limit = blocked.find(([lo]) => lo >= 0)?.[0];
    return limit === undefined || !Number.isFinite(limit) ? null : limit;
  }
  // Shrinking stops where the caliper would reach the axle.
  const lowest = -Math.min(...prepared.caliper.map((p) => p.y));
  const below = blocked
    .map(([lo]) => lo)
    .filter((lo) => lo < 0 && lo >= lowest)
    .sort((a, b) => b - a);
  return below.find((s) => clearAt(prepared, blocked, v, s)) ?? null;
}

/** The two numbers old records carry for a caliper, and the box they describe. */
export interface LegacyCaliperNumbers {
  rotorDiameterMm: number;
  /** how far the caliper reaches outward beyond the rotor edge */
  caliperRadialProjectionMm: number;
  /** how far the caliper's outermost face stands outboard of the hub mounting face */
  caliperOutboardMm: number;
}

/** Extent of the legacy box where nothing was recorded; the barrel and the spokes see only its top and its outboard face. */
export const LEGACY_BOX = { axialWidthMm: 110, belowRotorEdgeMm: 50 } as const;

/**
 * A box-shaped caliper outline from the two numbers stored before outlines were recorded: its top at the rotor radius plus
 * the projection, its outboard face where recorded. An estimate: callers say so and show no ✓/✕ from it.
 */
export function legacyCaliperOutline(numbers: LegacyCaliperNumbers): SectionPoint[] {
  const rotor = requirePositive(numbers?.rotorDiameterMm, 'rotorDiameterMm');
  const projection = requireNonNegative(numbers.caliperRadialProjectionMm, 'caliperRadialProjectionMm');
  const outboard = requireFinite(numbers.caliperOutboardMm, 'caliperOutboardMm');
  const top = rotor / 2 + projection;
  const bottom = Math.max(0, rotor / 2 - LEGACY_BOX.belowRotorEdgeMm);
  const inboard = outboard - LEGACY_BOX.axialWidthMm;
  return [
    { zMm: inboard, rMm: bottom },
    { zMm: outboard, rMm: bottom },
    { zMm: outboard, rMm: top },
    { zMm: inboard, rMm: top },
  ];
}

export interface LegacyWheelNumbers {
  barrelInnerDiameterMm: number;
  /** how far the spokes' back face stands outboard of the wheel's mounting face */
  spokeInsetMm: number;
}

/** Depth of barrel drawn for a legacy wheel; the check continues the barrel inboard anyway. */
const LEGACY_BARREL_DRAWN_MM = 100;

/** A wheel inside from the barrel's inner diameter and the spokes' inset: a square corner, no fillet. An estimate. */
export function legacyWheelInside(numbers: LegacyWheelNumbers): SectionPoint[] {
  const barrel = requirePositive(numbers?.barrelInnerDiameterMm, 'barrelInnerDiameterMm');
  const inset = requireFinite(numbers.spokeInsetMm, 'spokeInsetMm');
  return [
    { zMm: inset - LEGACY_BARREL_DRAWN_MM, rMm: barrel / 2 },
    { zMm: inset, rMm: barrel / 2 },
    { zMm: inset, rMm: 0 },
  ];
}
