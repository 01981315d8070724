import { like } from 'drizzle-orm';
import type { Db } from '../db/client';
import type { chassis, parts, swaps } from '../db/schema/index';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/**
 * "Orsino Vela: four-piston on the Halden H31" → "orsino-vela-four-piston-on-the-halden-h31". A text longer
 * than `maxLength` is cut at the last word boundary that fits, never inside a word (one word longer
 * than the limit is the only thing ever cut).
 */
export function slugify(text: string, maxLength = 80): string {
  const full = text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  if (full.length <= maxLength) return full;
  // the character after the cut tells whether a word ends exactly there
  const boundary = full[maxLength] === '-' ? maxLength : full.lastIndexOf('-', maxLength);
  return full.slice(0, boundary > 0 ? boundary : maxLength).replace(/-+$/, '');
}

/**
 * `base`, or `base-2`, `base-3` … the first that the table does not hold yet and `alsoTaken` does not
 * refuse (a swap's slug must not repeat another swap's old address either).
 */
export function uniqueSlug(
  db: Db | Tx,
  table: typeof swaps | typeof chassis | typeof parts,
  base: string,
  alsoTaken: (slug: string) => boolean = () => false,
): string {
  const root = base || 'untitled';
  const taken = new Set(
    db
      .select({ slug: table.slug })
      .from(table)
      .where(like(table.slug, `${root}%`))
      .all()
      .map((r) => r.slug),
  );
  const free = (slug: string) => !taken.has(slug) && !alsoTaken(slug);
  if (free(root)) return root;
  for (let n = 2; ; n++) if (free(`${root}-${n}`)) return `${root}-${n}`;
}
