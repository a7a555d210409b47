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

/** How long a link stays open when the sender does not choose: the shop's setting, 30 days unless changed. */
export const PROOF_DEFAULT_DAYS = 30;
export const PROOF_MIN_DAYS = 1;
export const PROOF_MAX_DAYS = 90;
/** The one answer for a made-up, revoked, replaced or expired link: true of each of them. */
export const PROOF_CLOSED_MESSAGE = 'This proof is closed';
/** What the customer can do about a closed link, shown under the heading. */
export const PROOF_CLOSED_ADVICE = 'The shop may have sent you a newer one: use the link in their latest message. If you cannot find it, ask the shop.';

/** Days a link stays open; the shop's default applies when absent. */
export const proofExpiryDays = z
  .number({ error: 'Give a number of days' })
  .int('Whole days only')
  .min(PROOF_MIN_DAYS, `At least ${PROOF_MIN_DAYS} day`)
  .max(PROOF_MAX_DAYS, `At most ${PROOF_MAX_DAYS} days`);

/** Sending a proof: the layout's draft as of `baseRevision` is frozen, or an existing version is named. */
export const proofSendInput = z
  .object({
    layoutId: z.string({ error: 'Choose a layout' }).uuid('Choose a layout'),
    /** A frozen version to send as it is. */
    versionNumber: z.number().int().min(1).max(100_000).optional(),
    /** Freeze the draft first; the revision it was read at, as for freezing. */
    baseRevision: z.number().int().min(1).max(1_000_000_000).optional(),
    message: optionalTextField({ max: 2000, multiline: true }),
    /** Days the link stays open; the shop's default expiry when absent. */
    expiresInDays: proofExpiryDays.optional(),
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
  /** The customer's photo of a sketch or note sent with the change request, for signed-in staff. */
  changesPhotoUrl: z.string().nullable(),
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
    /** Which page the link shows; later stages (e.g. after delivery) add their own value and branch on it. */
    stage: z.enum(['proof']),
    shop: z.object({ name: z.string(), email: z.string().nullable() }).strict(),
    jobTitle: z.string(),
    message: z.string().nullable(),
    state: z.enum(['sent', 'opened', 'approved', 'changes_asked']),
    expiresAt: z.string(),
    decidedAt: z.string().nullable(),
    approvedName: z.string().nullable(),
    changesComment: z.string().nullable(),
    /** The customer sent a photo with their change request (the photo itself stays with the shop). */
    changesPhotoSent: z.boolean(),
    /** The frozen layout document, as geometry draws it. */
    layout: z.unknown(),
    /**
     * The picture of the layout, drawn on the server: per mat (top first) SVG path data in
     * board inches, holes at the face and at the back edge. Null when it could not be drawn.
     */
    drawing: z.array(z.object({ face: z.string().max(4_000_000), back: z.string().max(4_000_000) }).strict()).max(20).nullable(),
    pieces: z.array(publicProofPiece),
    /** The frame the mats go into, when the shop has chosen one for the job: moulding, glazing and the outside size. */
    frame: z
      .object({
        moulding: z.string(),
        faceWidthIn: z.number(),
        glazing: z.string(),
        isGlass: z.boolean(),
        shadowboxDepthIn: z.number(),
        outerWidthIn: z.number(),
        outerHeightIn: z.number(),
      })
      .strict()
      .nullable(),
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
