import { z } from 'zod';
import { publicQuoteView } from '../quotes/schema';
import { optionalTextField, textField } from '../text/schema';

/** Where a proof stands. "expired" is never stored: it is read from the expiry date of an undecided proof. */
export const proofStates = ['sent', 'opened', 'approved', 'changes_asked', 'revoked', 'replaced', 'expired'] as const;
export type ProofState = (typeof proofStates)[number];
/** The states a row can hold. */
export const storedProofStates = ['sent', 'opened', 'approved', 'changes_asked', 'revoked', 'replaced'] as const;

export const proofStateLabels: Record<ProofState, string> = {
  sent: 'Sent',
  opened: 'Opened',
  approved: 'Approved',
  changes_asked: 'Changes asked',
  revoked: 'Revoked',
  replaced: 'Replaced',
  expired: 'Expired',
};

export const PROOF_DEFAULT_DAYS = 30;
export const PROOF_CLOSED_MESSAGE = 'This proof link is no longer open';

/** Sending a proof: the layout's draft as of `baseRevision` is frozen, or an existing version is named. */
export const proofSendInput = z
  .object({
    layoutId: z.string({ error: 'Choose a layout' }).uuid('Choose a layout'),
    /** A frozen version to send as it is. */
    versionNumber: z.number().int().min(1).max(100_000).optional(),
    /** Freeze the draft first; the revision it was read at, as for freezing. */
    baseRevision: z.number().int().min(1).max(1_000_000_000).optional(),
    message: optionalTextField({ max: 2000, multiline: true }),
    expiresInDays: z.number().int().min(1, 'At least 1 day').max(90, 'At most 90 days').default(PROOF_DEFAULT_DAYS),
    /** Also e-mail the link to the job's customer through the shop's mailer. */
    emailCustomer: z.boolean().default(false),
  })
  .refine((v) => (v.versionNumber === undefined) !== (v.baseRevision === undefined), {
    message: 'Send either a frozen version or the current draft',
    path: ['versionNumber'],
  });
export type ProofSendInput = z.input<typeof proofSendInput>;

/** The customer's answer: approve with their typed name, or ask for changes with a comment. */
export const proofApproveFields = z.object({ name: textField({ max: 120, required: 'Type your name to approve' }) });
export const proofChangesFields = z.object({ comment: textField({ max: 2000, multiline: true, required: 'Say what should change' }) });
export const proofDecisionInput = z.discriminatedUnion('decision', [
  proofApproveFields.extend({ decision: z.literal('approve') }),
  proofChangesFields.extend({ decision: z.literal('changes') }),
]);
export type ProofDecisionInput = z.input<typeof proofDecisionInput>;

/** A proof as the shop sees it on the job. */
export const proofSummary = z.object({
  id: z.string(),
  layoutId: z.string(),
  layoutName: z.string(),
  versionNumber: z.number(),
  state: z.enum(proofStates),
  message: z.string().nullable(),
  sentAt: z.string(),
  sentByName: z.string().nullable(),
  expiresAt: z.string(),
  openedAt: z.string().nullable(),
  decidedAt: z.string().nullable(),
  approvedName: z.string().nullable(),
  changesComment: z.string().nullable(),
});
export type ProofSummary = z.infer<typeof proofSummary>;

/** The answer to sending: the link is shown once and is never stored in a readable form. */
export const proofSent = z.object({
  proof: proofSummary,
  link: z.string(),
  /** Where the link was e-mailed, when it was. */
  emailedTo: z.string().nullable(),
  /** Why the e-mail failed; the proof and its link stand. */
  mailError: z.string().nullable(),
});

/** One piece as the customer reads it. */
export const publicProofPiece = z
  .object({
    /** Only because the layout's openings name their piece by it. */
    id: z.string(),
    label: z.string(),
    kind: z.string(),
    widthIn: z.number(),
    heightIn: z.number(),
    /** Served through the link itself; a traced garment's photo is placed by its outline's centre. */
    photo: z
      .object({ url: z.string(), widthIn: z.number(), heightIn: z.number(), traced: z.object({ centreX: z.number(), centreY: z.number() }).strict().nullable() })
      .strict()
      .nullable(),
  })
  .strict();

/** Everything the customer's page may see: nothing else leaves the server for a proof link. */
export const publicProofView = z
  .object({
    shop: z.object({ name: z.string(), email: z.string().nullable() }).strict(),
    jobTitle: z.string(),
    message: z.string().nullable(),
    state: z.enum(['sent', 'opened', 'approved', 'changes_asked']),
    expiresAt: z.string(),
    decidedAt: z.string().nullable(),
    approvedName: z.string().nullable(),
    changesComment: z.string().nullable(),
    /** The frozen layout document, as geometry draws it. */
    layout: z.unknown(),
    /**
     * The picture of the layout, drawn on the server: per mat (top first) SVG path data in
     * board inches, holes at the face and at the back edge. Null when it could not be drawn.
     */
    drawing: z.array(z.object({ face: z.string().max(4_000_000), back: z.string().max(4_000_000) }).strict()).max(20).nullable(),
    pieces: z.array(publicProofPiece),
    /** The price that travels with the proof, when the shop built one. */
    quote: publicQuoteView.nullable(),
    /** Once the frame is shipped, the approved proof's page asks how it arrived: the customer's own note and photos so far. */
    arrival: z
      .object({ comment: z.string().nullable(), photos: z.array(z.object({ url: z.string() }).strict()), maxPhotos: z.number() })
      .strict()
      .nullable(),
  })
  .strict();
export type PublicProofView = z.infer<typeof publicProofView>;
