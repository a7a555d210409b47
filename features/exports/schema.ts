import { z } from 'zod';
import { textField } from '../text/schema';

export const cutFileFormats = ['svg', 'dxf'] as const;
export type CutFileFormat = (typeof cutFileFormats)[number];

const profileId = textField({ max: 40, required: 'Choose a cutter profile', tooLong: 'No cutter profile has an id that long' });

/** GET /api/layouts/:id/versions/:number/export */
export const cutFileQuery = z.object({
  format: z.enum(cutFileFormats, { error: 'Choose svg or dxf' }),
  /** A cutter profile id from the shop settings; the first profile when absent. */
  profile: profileId.optional(),
  /** A 1-based board number (mats top first, then the mounting board when it is cut) or "all". */
  mat: textField({ max: 8 })
    .regex(/^(all|[1-9][0-9]{0,2})$/, 'Choose a mat number such as 1, or all')
    .default('all'),
});
export type CutFileQuery = z.infer<typeof cutFileQuery>;

/** GET /api/layouts/:id/versions/:number/cut-sheet */
export const cutSheetQuery = z.object({
  /** The sheet gives sizes of the bevel edge this profile follows. */
  profile: profileId.optional(),
});

/** Where a browser fetches a cut file; the same path the server routes. */
export function cutFilePath(layoutId: string, versionNumber: number, query: { format: CutFileFormat; profile: string; mat: string }): string {
  const params = new URLSearchParams({ format: query.format, profile: query.profile, mat: query.mat });
  return `/api/layouts/${encodeURIComponent(layoutId)}/versions/${versionNumber}/export?${params.toString()}`;
}

export function cutSheetPath(layoutId: string, versionNumber: number, profile?: string): string {
  const query = profile ? `?${new URLSearchParams({ profile }).toString()}` : '';
  return `/api/layouts/${encodeURIComponent(layoutId)}/versions/${versionNumber}/cut-sheet${query}`;
}

/** One finding that stops a version being frozen or cut, as a 422 lists it. */
export const blockingFinding = z.object({
  code: z.string(),
  message: z.string(),
  openingIds: z.array(z.string()).default([]),
  /** Inches, exact. */
  measured: z.number().nullable().default(null),
  required: z.number().nullable().default(null),
});
export type BlockingFinding = z.infer<typeof blockingFinding>;

/** The body of a 422 "layout_cannot_be_cut" beside its error. */
export const blockingFindingsBody = z.object({ findings: z.array(blockingFinding) });

/** The findings a refused freeze or export carried, or none. */
export function blockingFindingsOf(body: unknown): BlockingFinding[] {
  const parsed = blockingFindingsBody.safeParse(body);
  return parsed.success ? parsed.data.findings : [];
}

/** Why a version may go to the cutter: the customer approved it on a proof, or an owner released it with a reason. */
export const cutApproval = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('proof'), approvedName: z.string(), approvedAt: z.string() }),
  z.object({ kind: z.literal('release'), reason: z.string(), releasedBy: z.string().nullable(), releasedAt: z.string() }),
]);
export type CutApproval = z.infer<typeof cutApproval>;

/** GET /api/layouts/:id/versions/:number/approval */
export const cutApprovalBody = z.object({
  approval: cutApproval.nullable(),
  /** The version of this layout the customer approved, when it is another one. */
  approvedVersion: z.number().int().nullable(),
});

/** POST /api/layouts/:id/versions/:number/release (owners): cut without the customer's approval, with the reason logged. */
export const cutReleaseInput = z.object({
  reason: textField({ max: 500, required: 'Say why this version is cut without the customer approving it' }),
});

/** One line for the cut sheet and the panel, in plain words. */
export function cutApprovalText(approval: CutApproval): string {
  if (approval.kind === 'proof') return `Approved by the customer (${approval.approvedName}) on the proof, ${approval.approvedAt.slice(0, 10)}`;
  const who = approval.releasedBy ? ` by ${approval.releasedBy}` : '';
  return `Released for cutting without the customer's approval${who}, ${approval.releasedAt.slice(0, 10)}: ${approval.reason}`;
}
