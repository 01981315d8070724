import { z } from 'zod';

/** what an admin changed in the catalogue */
export const catalogueSubjects = ['chassis', 'part'] as const;
export type CatalogueSubject = (typeof catalogueSubjects)[number];
export const catalogueActions = ['edit', 'merge', 'approve'] as const;
export type CatalogueAction = (typeof catalogueActions)[number];

export const catalogueSubjectSchema = z.enum(catalogueSubjects);
