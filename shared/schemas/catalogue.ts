import { z } from 'zod';
import { partKindSchema, type PartKind } from './enums';
import { singleLine } from './text';

// Picking an existing catalogue part in the submission form: a search as you type, and the match the
// server finds for a part the member is about to propose.

export const partSearchQuerySchema = z.object({
  q: singleLine().trim().max(80, 'A search is at most 80 characters').default(''),
  kind: partKindSchema.optional(),
});
export type PartSearchQuery = z.infer<typeof partSearchQuerySchema>;

export const partMatchQuerySchema = z.object({
  maker: singleLine().trim().max(80, 'A maker is at most 80 characters'),
  /** the line's part numbers, comma-separated as the form takes them */
  numbers: singleLine()
    .trim()
    .max(600, 'At most 600 characters of part numbers')
    .transform((s) =>
      s
        .split(',')
        .map((n) => n.trim())
        .filter(Boolean)
        .slice(0, 12),
    ),
});

/** a catalogue part as the form shows and copies it */
export type CataloguePartOption = {
  id: number;
  kind: PartKind;
  name: string;
  maker: string;
  partNumbers: string[];
  cameOn: string[];
};

export type PartSearchResponse = { items: CataloguePartOption[] };
/** the part the proposed one already is (same maker, same number after normalising), and the number that matched */
export type PartMatchResponse = { match: { part: CataloguePartOption; number: string } | null };
