/**
 * Plane geometry for the section check: points, segments and polygons in one plane.
 * Textbook constructions (orthogonal projection onto a segment, the parametric segment intersection,
 * the even–odd crossing rule for point in polygon); no tolerances beyond `EPS`.
 */

export interface Vec {
  x: number;
  y: number;
}

export const EPS = 1e-9;

const sub = (a: Vec, b: Vec): Vec => ({ x: a.x - b.x, y: a.y - b.y });
const dot = (a: Vec, b: Vec) => a.x * b.x + a.y * b.y;
const cross = (a: Vec, b: Vec) => a.x * b.y - a.y * b.x;
export const distance = (a: Vec, b: Vec) => Math.hypot(a.x - b.x, a.y - b.y);
export const along = (a: Vec, b: Vec, t: number): Vec => ({ x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t });

/** The point of segment ab nearest to p (orthogonal projection, clamped to the segment). */
export function closestOnSegment(p: Vec, a: Vec, b: Vec): Vec {
  const d = sub(b, a);
  const length2 = dot(d, d);
  if (length2 === 0) return a;
  const t = Math.min(1, Math.max(0, dot(sub(p, a), d) / length2));
  return along(a, b, t);
}

export function pointSegmentDistance(p: Vec, a: Vec, b: Vec): number {
  return distance(p, closestOnSegment(p, a, b));
}

/** A point both segments share, or null. Collinear overlaps answer with one shared endpoint. */
export function segmentIntersection(a: Vec, b: Vec, c: Vec, d: Vec): Vec | null {
  const r = sub(b, a);
  const s = sub(d, c);
  const denominator = cross(r, s);
  const ac = sub(c, a);
  if (Math.abs(denominator) > EPS * Math.max(1, Math.hypot(r.x, r.y) * Math.hypot(s.x, s.y))) {
    const t = cross(ac, s) / denominator;
    const u = cross(ac, r) / denominator;
    return t >= -EPS && t <= 1 + EPS && u >= -EPS && u <= 1 + EPS ? along(a, b, Math.min(1, Math.max(0, t))) : null;
  }
  // Parallel: they share a point only if collinear, and then one of the four endpoints lies on the other segment.
  for (const [p, e0, e1] of [
    [c, a, b],
    [d, a, b],
    [a, c, d],
    [b, c, d],
  ] as const) {
    if (pointSegmentDistance(p, e0, e1) <= EPS) return p;
  }
  return null;
}

export interface SegmentGap {
  distance: number;
  /** the nearest point on the first segment */
  onFirst: Vec;
  /** the nearest point on the second segment */
  onSecond: Vec;
}

/** Shortest distance between segments ab and cd: zero where they meet, else reached at an endpoint of one of them. */
export function segmentGap(a: Vec, b: Vec, c: Vec, d: Vec): SegmentGap {
  const meet = segmentIntersection(a, b, c, d);
  if (meet) return { distance: 0, onFirst: meet, onSecond: meet };
  const options: SegmentGap[] = [
    { onFirst: a, onSecond: closestOnSegment(a, c, d) },
    { onFirst: b, onSecond: closestOnSegment(b, c, d) },
    { onFirst: closestOnSegment(c, a, b), onSecond: c },
    { onFirst: closestOnSegment(d, a, b), onSecond: d },
  ].map((o) => ({ ...o, distance: distance(o.onFirst, o.onSecond) }));
  return options.reduce((best, o) => (o.distance < best.distance ? o : best));
}

/** Even–odd rule: a ray from p crosses the boundary an odd number of times when p is inside. */
export function pointInPolygon(p: Vec, polygon: readonly Vec[]): boolean {
  let inside = false;
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i++) {
    const a = polygon[i];
    const b = polygon[j];
    if (a.y > p.y !== b.y > p.y && p.x < ((b.x - a.x) * (p.y - a.y)) / (b.y - a.y) + a.x) inside = !inside;
  }
  return inside;
}

/** The edges of a closed polygon, last point back to the first. */
export function closedEdges(polygon: readonly Vec[]): [Vec, Vec][] {
  return polygon.map((p, i) => [p, polygon[(i + 1) % polygon.length]]);
}

/** The edges of an open polyline. */
export function openEdges(polyline: readonly Vec[]): [Vec, Vec][] {
  return polyline.slice(1).map((p, i) => [polyline[i], p]);
}

type Interval = [number, number];

/** { s : lo < α + β s < hi }, or null when empty. */
function slab(alpha: number, beta: number, lo: number, hi: number): Interval | null {
  if (Math.abs(beta) < EPS) return alpha > lo && alpha < hi ? [-Infinity, Infinity] : null;
  const s0 = (lo - alpha) / beta;
  const s1 = (hi - alpha) / beta;
  return [Math.min(s0, s1), Math.max(s0, s1)];
}

/** { s : |o + s u − c| < ρ } for a unit direction u. */
function discChord(o: Vec, u: Vec, c: Vec, radius: number): Interval | null {
  const oc = sub(o, c);
  const half = dot(u, oc);
  const discriminant = half * half - (dot(oc, oc) - radius * radius);
  if (discriminant <= 0) return null;
  const root = Math.sqrt(discriminant);
  return [-half - root, -half + root];
}

/**
 * The open interval of s for which the point o + s·u (u a unit vector) lies closer than `radius` to segment ab,
 * or null. The set within `radius` of a segment is convex (two discs and a rectangle), so a line meets it in one interval.
 */
export function lineNearSegment(o: Vec, u: Vec, a: Vec, b: Vec, radius: number): Interval | null {
  const parts: Interval[] = [];
  for (const end of [a, b]) {
    const chord = discChord(o, u, end, radius);
    if (chord) parts.push(chord);
  }
  const d = sub(b, a);
  const length = Math.hypot(d.x, d.y);
  if (length > 0) {
    const t = { x: d.x / length, y: d.y / length };
    const n = { x: -t.y, y: t.x };
    const oa = sub(o, a);
    const across = slab(dot(oa, t), dot(u, t), 0, length);
    const beside = slab(dot(oa, n), dot(u, n), -radius, radius);
    if (across && beside) {
      const lo = Math.max(across[0], beside[0]);
      const hi = Math.min(across[1], beside[1]);
      if (lo < hi) parts.push([lo, hi]);
    }
  }
  if (parts.length === 0) return null;
  return [Math.min(...parts.map((p) => p[0])), Math.max(...parts.map((p) => p[1]))];
}

/** Real roots of a t² + b t + c = 0 (a linear equation when a vanishes). */
export function roots(a: number, b: number, c: number): number[] {
  if (Math.abs(a) < EPS) return Math.abs(b) < EPS ? [] : [-c / b];
  const discriminant = b * b - 4 * a * c;
  if (discriminant < 0) return [];
  const root = Math.sqrt(discriminant);
  return [(-b - root) / (2 * a), (-b + root) / (2 * a)];
}
