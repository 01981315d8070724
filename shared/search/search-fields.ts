import { categoryLabels } from '../schemas/enums';
import type { SearchDocument } from './search-document';

// Which text of a swap is searched, and how much a match in each place counts.

export type Field = 'code' | 'model' | 'make' | 'partNumbers' | 'title' | 'partNames' | 'adapter' | 'cameOn' | 'tags';
export const fields: readonly Field[] = [
  'code',
  'model',
  'make',
  'partNumbers',
  'title',
  'partNames',
  'adapter',
  'cameOn',
  'tags',
];

/** Chassis and part matches rank above the title, the title above the rest. */
export const fieldBoosts: Record<Field, number> = {
  code: 10,
  model: 8,
  partNumbers: 6,
  make: 3,
  title: 2,
  partNames: 1.2,
  adapter: 1,
  cameOn: 0.8,
  tags: 0.5,
};

/** Two-letter prefixes only reach these: "ha" means Halden, not every word that starts with it. */
export const chassisFields: readonly Field[] = ['code', 'model', 'make'];

export function fieldText(doc: SearchDocument, field: Field): string {
  switch (field) {
    case 'code':
      return doc.chassis.code;
    case 'model':
      return doc.chassis.model;
    case 'make':
      return doc.chassis.make;
    case 'partNumbers':
      return [...doc.partNumbers, ...(doc.otherNumbers ?? []), doc.adapter?.partNumber ?? ''].join(' ');
    case 'title':
      return doc.title;
    case 'partNames':
      return doc.partNames.join(' ');
    case 'adapter':
      return doc.adapter ? `${doc.adapter.name} ${doc.adapter.maker}` : '';
    case 'cameOn':
      return doc.cameOn.join(' ');
    case 'tags':
      return `${doc.axle} axle ${categoryLabels[doc.category]}`;
  }
}

const hasDigit = /\d/;
const hasLetter = /\p{L}/u;

/** Typos are forgiven on words of four letters or more, and by one character on short codes that mix letters and digits (h3l → h31). */
export function fuzzyFor(term: string): number | false {
  if (hasDigit.test(term)) return hasLetter.test(term) && term.length >= 3 && term.length <= 5 ? 1 : false;
  return term.length >= 4 ? 0.2 : false;
}

/** The most edits a typo may have: a fraction of the word's length, at most two. */
export function maxEditsFor(term: string): number {
  const fuzzy = fuzzyFor(term);
  if (!fuzzy) return 0;
  return fuzzy < 1 ? Math.min(2, Math.round(term.length * fuzzy)) : fuzzy;
}
