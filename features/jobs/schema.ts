import { z } from 'zod';
import { frameChoice } from '../settings/materials';
import { optionalTextField, textField } from '../text/schema';

export const jobStatuses = [
  'taken_in',
  'designing',
  'awaiting_approval',
  'approved',
  'cutting',
  'assembling',
  'ready',
  'shipped',
  'collected',
  'cancelled',
] as const;
export const jobStatusSchema = z.enum(jobStatuses);
export type JobStatus = z.infer<typeof jobStatusSchema>;

/** Work that has left the shop or will not happen; the list hides it unless asked. */
export const finishedStatuses: readonly JobStatus[] = ['shipped', 'collected', 'cancelled'];
export const openStatuses: JobStatus[] = jobStatuses.filter((s) => !finishedStatuses.includes(s));

/** Plain words a framer and a customer both understand. */
export const jobStatusLabels: Record<JobStatus, string> = {
  taken_in: 'Taken in',
  designing: 'Designing',
  awaiting_approval: 'Waiting for approval',
  approved: 'Approved',
  cutting: 'Cutting',
  assembling: 'Assembling',
  ready: 'Ready',
  shipped: 'Shipped',
  collected: 'Collected',
  cancelled: 'Cancelled',
};

const isoDate = z
  .string()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2027-03-14')
  .refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)) && new Date(`${v}T00:00:00Z`).toISOString().startsWith(v), 'Not a real calendar date');

export const jobInput = z.object({
  title: textField({ max: 200, required: 'Give the job a title' }),
  customerId: z.string({ error: 'Choose a customer' }).uuid('Choose a customer'),
  dueDate: z
    .union([z.literal(''), isoDate])
    .nullish()
    .transform((v) => (v ? v : null)),
  notes: optionalTextField({ max: 4000, multiline: true }),
  /** The moulding, glazing and shadowbox depth, once chosen. */
  frame: frameChoice.nullish(),
});
export type JobInput = z.input<typeof jobInput>;

/** A partial edit of a job's own fields; status moves through its own route. */
export const jobUpdate = jobInput.partial().refine((v) => Object.keys(v).length > 0, { message: 'Change at least one field' });
export type JobUpdate = z.input<typeof jobUpdate>;

export const jobStatusChange = z.object({
  status: jobStatusSchema,
  /** Why, in a few words: shown in the activity log. */
  note: textField({ max: 500 }).optional(),
});

export const jobSorts = ['due', 'created', 'updated', 'title', 'status'] as const;

const commaList = <T extends z.ZodType>(item: T) =>
  z.preprocess((v) => (typeof v === 'string' ? v.split(',').filter(Boolean) : v), z.array(item).max(20));

/** The list screen's filters, as query-string values. */
export const jobListQuery = z.object({
  status: commaList(jobStatusSchema).optional(),
  customerId: z.string().uuid().optional(),
  dueFrom: isoDate.optional(),
  dueTo: isoDate.optional(),
  q: textField({ max: 200 }).optional(),
  sort: z.enum(jobSorts).default('due'),
  order: z.enum(['asc', 'desc']).default('asc'),
  limit: z.coerce.number().int().min(1).max(100).default(50),
  offset: z.coerce.number().int().min(0).max(100_000).default(0),
  /** Count every match ("exact") or not ("none"); by default only the first page is counted. */
  count: z.enum(['exact', 'none']).optional(),
});
export type JobListQuery = z.input<typeof jobListQuery>;

export const job = z.object({
  id: z.string().uuid(),
  title: z.string(),
  customerId: z.string().uuid(),
  customerName: z.string(),
  dueDate: z.string().nullable(),
  notes: z.string().nullable(),
  frame: frameChoice.nullable(),
  status: jobStatusSchema,
  statusChangedAt: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Job = z.infer<typeof job>;

/** `total` is null when the count was not asked for (pages after the first). */
export const jobList = z.object({ jobs: z.array(job), total: z.number().int().nullable() });
