import { z } from 'zod';
import { plainTextDocument, textField } from '../text/schema';

export const layoutCreateInput = z.object({
  name: textField({ max: 120, required: 'Name the layout' }),
  /** A whole layout document to start from; the shop's starter layout when absent. */
  document: plainTextDocument(z.unknown()).optional(),
});

export const draftSaveInput = z.object({
  document: plainTextDocument(z.unknown().refine((v) => v !== undefined, 'Send the layout document')),
  /** The draft revision this edit started from; a newer one on the server means someone else saved first. */
  baseRevision: z.number({ error: 'Send the revision the edit started from' }).int().min(1),
});

export const freezeInput = z.object({
  baseRevision: z.number({ error: 'Send the revision being frozen' }).int().min(1),
  note: textField({ max: 300 }).optional(),
});

export const layoutSummary = z.object({
  id: z.string().uuid(),
  jobId: z.string().uuid(),
  name: z.string(),
  draftRevision: z.number().int(),
  draftBasedOnVersion: z.number().int().nullable(),
  versionCount: z.number().int(),
  updatedAt: z.string(),
});
export type LayoutSummary = z.infer<typeof layoutSummary>;

export const versionSummary = z.object({
  number: z.number().int(),
  note: z.string().nullable(),
  frozenAt: z.string(),
  frozenByName: z.string().nullable(),
});

export const layoutDetail = z.object({
  layout: layoutSummary.extend({
    /** The whole document; screens pass it through geometry's parseLayout. */
    draft: z.unknown(),
    /** The name the server keeps each outline's points under, by opening id: a save may send the name instead of the points. */
    outlineRefs: z.record(z.string(), z.string()).default({}),
    updatedByName: z.string().nullable(),
  }),
  versions: z.array(versionSummary),
});
export type LayoutDetail = z.infer<typeof layoutDetail>;

export const versionDetail = z.object({
  version: versionSummary.extend({ layoutId: z.string().uuid(), document: z.unknown() }),
});

/** The body of a 409 for a stale save: the error and the draft that won. */
export const staleDraft = z.object({
  current: z.object({ draft: z.unknown(), outlineRefs: z.record(z.string(), z.string()).default({}), draftRevision: z.number().int(), updatedByName: z.string().nullable() }),
});
