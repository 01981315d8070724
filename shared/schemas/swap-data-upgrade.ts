import type { Axle } from './enums';
import { swapDataSchema, SWAP_DATA_VERSION, type FastenerKind, type MachiningComponent, type SwapData } from './swap-data';
import type { SwapDataV1 } from './swap-data-v1';

// Every stored revision before version 2 holds version-1 data, and approved revisions are never
// rewritten. So old data is upgraded when it is read: this one pure function, used by the database
// column (server/db/schema/swaps.ts) and nowhere else needed.

type Shape = Record<string, unknown>;
const isRecord = (v: unknown): v is Shape => typeof v === 'object' && v !== null && !Array.isArray(v);

export type UpgradeContext = {
  /** the swap's axle; version 1 did not say which axle a rotor or spacer belongs to */
  axle?: Axle;
};

/**
 * Returns version-2 data for any stored revision data. Version-2 data is returned as it is (after the
 * schema's defaults are applied when it validates); version-1 data is converted field by field.
 */
export function upgradeSwapData(data: unknown, context: UpgradeContext = {}): SwapData {
  if (isRecord(data) && data.schemaVersion === SWAP_DATA_VERSION) {
    const parsed = swapDataSchema.safeParse(data);
    // a draft may hold rows that are not complete yet; it is still the author's data, served as stored
    return parsed.success ? parsed.data : (data as SwapData);
  }
  if (!isRecord(data)) throw new TypeError('Swap data is not an object');
  return swapDataSchema.parse(fromVersion1(data as unknown as SwapDataV1, context));
}

function inferAxle(v1: SwapDataV1): Axle {
  const b = v1.brakes;
  if (!b) return 'front';
  const same = (x: unknown, y: unknown) => JSON.stringify(x) === JSON.stringify(y);
  return same(b.before.front, b.after.front) && !same(b.before.rear, b.after.rear) ? 'rear' : 'front';
}

/** first pattern found earliest in the text wins; version 1 named fasteners in free text */
const fastenerPatterns: [RegExp, FastenerKind][] = [
  [/caliper[- ]bracket/i, 'bracket_mount'],
  [/banjo/i, 'banjo'],
  [/bleed/i, 'bleed_screw'],
  [/guide pin|slide pin/i, 'guide_pin'],
  [/wheel (bolt|nut|stud)/i, 'wheel'],
  [/spacer/i, 'spacer_mount'],
  [/rotor|disc screw/i, 'rotor_screw'],
  [/bush|drop link|anti-roll|strut|arm\b/i, 'suspension'],
  [/caliper|carrier/i, 'caliper_mount'],
  [/adapter|bracket/i, 'bracket_mount'],
];

export function fastenerKindFromText(text: string): FastenerKind {
  let best: { at: number; kind: FastenerKind } | null = null;
  for (const [pattern, kind] of fastenerPatterns) {
    const at = text.search(pattern);
    if (at >= 0 && (!best || at < best.at)) best = { at, kind };
  }
  return best?.kind ?? 'other';
}

/** in order of precedence: a knuckle lug named beside a caliper ear is still work on the knuckle */
const componentPatterns: [RegExp, MachiningComponent][] = [
  [/knuckle|upright/i, 'knuckle'],
  [/hub/i, 'hub'],
  [/subframe|crossmember/i, 'subframe'],
  [/caliper body|caliper/i, 'caliper_body'],
  [/bracket|adapter/i, 'bracket'],
  [/dust shield|splash/i, 'dust_shield'],
  [/wheel|rim|barrel|spoke/i, 'wheel'],
];

export function machiningComponentFromText(text: string): MachiningComponent {
  return componentPatterns.find(([pattern]) => pattern.test(text))?.[1] ?? 'other';
}

const THREAD = /\b(M\d{1,2}(?:[.,]\d)?\s*[x×]\s*\d(?:[.,]\d{1,2})?)/i;

function fromVersion1(v1: SwapDataV1, context: UpgradeContext): Shape {
  const axle = context.axle ?? inferAxle(v1);
  const usedIds = new Map<string, number>();
  const idFor = (kind: FastenerKind) => {
    const base = kind.replace(/_/g, '-');
    const n = (usedIds.get(base) ?? 0) + 1;
    usedIds.set(base, n);
    return n === 1 ? base : `${base}-${n}`;
  };
  const fasteners: Shape[] = [];
  const torque = (v1.torque ?? []).map((row) => {
    const kind = fastenerKindFromText(row.fastener);
    const id = idFor(kind);
    fasteners.push({ id, kind, label: row.fastener, thread: THREAD.exec(row.fastener)?.[1].replace(/\s/g, '') ?? '' });
    const locked = /thread-?lock/i.test(`${row.fastener} ${row.notes ?? ''}`);
    return { fastenerId: id, nm: row.nm, lubrication: locked ? 'thread_locker' : 'not_stated', singleUse: false, notes: row.notes ?? '' };
  });

  const shims = (v1.shims ?? []).map((s) => ({
    joint: /knuckle|hub carrier|upright/i.test(s.location) ? 'bracket_to_knuckle' : 'caliper_to_bracket',
    // version 1 only knew centring shims
    direction: 'axial',
    thicknessMm: s.thicknessMm,
    quantity: s.quantity,
    notes: s.location,
  }));
  const centring =
    v1.shimTargetMm && v1.shimTargetMm > 0 && shims.length > 0
      ? {
          joint: shims[0].joint,
          gapMm: v1.shimTargetMm,
          // version 1 counted shims over the whole axle and gave the stack per bolt
          positions: Math.max(...shims.filter((s) => s.joint === shims[0].joint).map((s) => s.quantity)),
        }
      : null;

  const wheel = v1.wheel
    ? {
        ...v1.wheel,
        testedWheels: (v1.wheel.testedWheels ?? []).map((t) => ({
          ...t,
          outcome: (t.radialClearanceMm ?? 0) < 0 || (t.spokeClearanceMm ?? 0) < 0 ? 'does_not_fit' : 'fits',
        })),
      }
    : null;

  const disc = (c: Shape) => ({ kind: 'disc', ...c });
  const brakes = v1.brakes
    ? {
        ...v1.brakes,
        before: { front: disc(v1.brakes.before.front), rear: disc(v1.brakes.before.rear) },
        after: { front: disc(v1.brakes.after.front), rear: disc(v1.brakes.after.rear) },
      }
    : null;

  const { shimTargetMm: _target, parkingBrakeKept, ...rest } = v1;
  return {
    ...rest,
    schemaVersion: SWAP_DATA_VERSION,
    calipers: [],
    rotors: (v1.rotors ?? []).map((r) => ({ ...r, axle })),
    shims,
    centring,
    spacers: (v1.spacers ?? []).map((s) => ({ ...s, axle })),
    machining: (v1.machining ?? []).map((m) => ({ ...m, component: machiningComponentFromText(m.where) })),
    fasteners,
    torque,
    wheel,
    brakes,
    parkingBrake: parkingBrakeKept === null || parkingBrakeKept === undefined ? null : { type: 'not_stated', kept: parkingBrakeKept },
  };
}
