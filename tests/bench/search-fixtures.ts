import type { SearchDocument } from '../../shared/search/search-document';
import { axles, categories, machiningLevels } from '../../shared/schemas/enums';

// Synthetic, invented search documents shaped like approved swaps, and queries people type.
// Seeded so every run measures the same data.

export function rng(seed: number) {
  let s = seed >>> 0;
  const next = () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const int = (lo: number, hi: number) => lo + Math.floor(next() * (hi - lo + 1));
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(next() * xs.length)];
  return { next, int, pick };
}

const onsets = ['b', 'br', 'c', 'd', 'dr', 'f', 'g', 'h', 'k', 'l', 'm', 'n', 'p', 'r', 's', 'st', 't', 'tr', 'v', 'w', 'z'];
const vowels = ['a', 'e', 'i', 'o', 'u', 'ae', 'ia', 'ou'];
const codas = ['', 'n', 'r', 'l', 'th', 'sk', 'nd', 'x', 'm', 'ss'];

type Chassis = SearchDocument['chassis'];
type Part = { name: string; numbers: string[]; cameOn: string[] };

const partKinds = [
  [
    'four-piston fixed caliper',
    'two-piston sliding caliper',
    'six-piston caliper',
    'single-piston caliper',
    'rear caliper with handbrake lever',
  ],
  ['vented rotor', 'solid rotor', 'drilled rotor', 'two-piece floating rotor', 'rotor with drum hat'],
  ['pad set', 'braided brake line', 'master cylinder', 'wheel bolt set', 'hub-centric spacer', 'caliper bracket bolts'],
  ['coilover strut', 'anti-roll bar', 'knuckle', 'hub and bearing', 'drive shaft', 'wheel'],
] as const;

const titleTemplates = [
  (donor: string, part: string) => `${donor} ${part} conversion`,
  (donor: string, part: string) => `${donor} ${part}s on the stock knuckle`,
  (donor: string, part: string, mm: number) => `${mm} mm ${part} upgrade with ${donor} parts`,
  (donor: string, part: string) => `Bolt-on ${donor} ${part} swap`,
  (donor: string, part: string, mm: number) => `${donor} ${part} and ${mm} mm rotors behind 16 inch wheels`,
  (donor: string, part: string) => `Budget ${part} swap from a ${donor}`,
];

export function makeWorld(seed = 7, chassisCount = 600, makeCount = 60) {
  const r = rng(seed);
  const word = (syllables: number) => {
    let w = '';
    for (let i = 0; i < syllables; i++) w += r.pick(onsets) + r.pick(vowels) + (i === syllables - 1 ? r.pick(codas) : '');
    return w[0].toUpperCase() + w.slice(1);
  };
  const makes = Array.from({ length: makeCount }, () => word(r.int(2, 3)));
  const chassis: Chassis[] = [];
  const seen = new Set<string>();
  while (chassis.length < chassisCount) {
    const make = r.pick(makes);
    const numeric = r.next() < 0.5;
    const model = numeric ? `${make[0]}${r.int(1, 9)}${r.int(0, 9)}` : word(2);
    const code = numeric ? model : `${model[0]}${String.fromCharCode(65 + r.int(0, 25))}${r.int(1, 99)}`;
    const slug = `${make}-${model}-${code}`.toLowerCase();
    if (seen.has(slug)) continue;
    seen.add(slug);
    const yearFrom = r.int(1965, 2018);
    chassis.push({ slug, make, model, code, yearFrom, yearTo: r.next() < 0.1 ? null : yearFrom + r.int(3, 12) });
  }
  const makers = Array.from(
    { length: 40 },
    () => `${word(2)} ${r.pick(['Fabrication', 'Performance', 'Motorsport', 'Engineering', 'Brakes'])}`,
  );
  return { r, word, makes, chassis, makers };
}

export type World = ReturnType<typeof makeWorld>;

function partNumber(r: World['r'], c: Chassis) {
  const prefix = (c.make[0] + c.model[0]).toUpperCase();
  const sep = r.pick(['-', '-', '-', '.', '']);
  return [prefix, r.int(100, 999), r.int(100, 999), r.pick(['L', 'R', 'A', 'B', 'X'])].join(sep);
}

export function makeDocuments(count: number, world: World): SearchDocument[] {
  const { r, chassis, makers } = world;
  const label = (c: Chassis) => `${c.make} ${c.model} ${r.int(1, 3)}.${r.int(0, 9)} (${c.yearFrom}–${c.yearTo ?? 'on'})`;
  const parts: Part[] = Array.from({ length: Math.max(200, Math.round(count * 0.6)) }, () => {
    const donor = r.pick(chassis);
    const kind = r.pick(r.pick(partKinds));
    return {
      name: `${donor.model} ${kind}`,
      numbers: Array.from({ length: r.int(1, 3) }, () => partNumber(r, donor)),
      cameOn: Array.from({ length: r.int(1, 3) }, () => label(r.next() < 0.7 ? donor : r.pick(chassis))),
    };
  });
  const start = Date.parse('2019-01-01T00:00:00Z');
  return Array.from({ length: count }, (_, i): SearchDocument => {
    const c = r.pick(chassis);
    const used = Array.from({ length: r.int(1, 4) }, () => r.pick(parts));
    const main = used[0];
    const donorModel = main.name.split(' ')[0];
    const mm = r.pick([280, 300, 312, 320, 330, 345, 355]);
    const title = r.pick(titleTemplates)(donorModel, main.name.slice(donorModel.length + 1), mm);
    const adapterMaker = r.pick(makers);
    const costs = Array.from({ length: r.int(0, 3) }, () => r.int(80, 3000) * 100);
    return {
      id: i + 1,
      slug: `${c.slug}-${title.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-${i + 1}`.slice(0, 90),
      title,
      chassis: c,
      axle: r.next() < 0.7 ? axles[0] : axles[1],
      category: r.next() < 0.75 ? 'brakes' : r.pick(categories),
      partNames: [...new Set(used.map((p) => p.name))],
      partNumbers: [...new Set(used.flatMap((p) => p.numbers))],
      cameOn: [...new Set(used.flatMap((p) => p.cameOn))],
      adapter:
        r.next() < 0.7
          ? {
              name: `${c.code} ${r.pick(['caliper bracket', 'adapter plate', 'relocation bracket'])}`,
              maker: adapterMaker,
              partNumber: `${adapterMaker.slice(0, 2).toUpperCase()}-${c.code}-${r.int(10, 99)}`,
            }
          : null,
      minWheelIn: r.next() < 0.85 ? r.pick([14, 15, 15, 16, 16, 17, 18]) : null,
      machining: r.pick(machiningLevels),
      parkingBrakeKept: r.next() < 0.5 ? null : r.next() < 0.7,
      cost: costs.length ? { min: Math.min(...costs), max: Math.max(...costs), currency: 'EUR' } : null,
      fittedCount: Math.floor(r.next() ** 3 * 40),
      updatedAt: new Date(start + r.int(0, 5 * 365 * 86400) * 1000).toISOString(),
    };
  });
}

function typo(r: World['r'], w: string) {
  if (w.length < 5) return w;
  const i = r.int(1, w.length - 2);
  return r.pick([
    () => w.slice(0, i) + w.slice(i + 1), // drop a letter
    () => w.slice(0, i) + w[i + 1] + w[i] + w.slice(i + 2), // swap two
    () => w.slice(0, i) + 'e' + w.slice(i + 1), // wrong letter
  ])();
}

/** Queries people type: codes, models, prefixes while typing, typos, part numbers in several spellings, a few words together. */
export function makeQueries(count: number, docs: SearchDocument[], world: World): string[] {
  const { r } = world;
  const qs: string[] = [];
  const kinds = [
    (d: SearchDocument) => d.chassis.code,
    (d: SearchDocument) => `${d.chassis.make} ${d.chassis.model}`,
    (d: SearchDocument) => d.chassis.make.slice(0, r.int(2, 4)).toLowerCase(),
    (d: SearchDocument) => d.title.split(' ').slice(0, 2).join(' ').slice(0, -r.int(0, 2)),
    (d: SearchDocument) => typo(r, d.chassis.make.toLowerCase()),
    (d: SearchDocument) => `${typo(r, d.chassis.make)} ${d.chassis.code}`,
    (d: SearchDocument) => r.pick(d.partNumbers),
    (d: SearchDocument) =>
      r
        .pick(d.partNumbers)
        .replace(/[^A-Za-z0-9]/g, '')
        .toLowerCase(),
    (d: SearchDocument) => r.pick(d.partNumbers).slice(0, r.int(4, 7)),
    (d: SearchDocument) => `${d.chassis.code} ${typo(r, r.pick(['caliper', 'rotor', 'spacer', 'bracket']))}`,
    (d: SearchDocument) => `${d.chassis.model} ${d.axle} ${d.partNames[0].split(' ').at(-1)}`,
    () => r.pick(['calip', 'rotor', 'four-piston', 'vented', 'hub-centric spacer', 'drum hat', 'brack']),
  ];
  while (qs.length < count) qs.push(kinds[qs.length % kinds.length](r.pick(docs)));
  return qs;
}
