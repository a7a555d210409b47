import { z } from 'zod';

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
  title: z.string({ error: 'Give the job a title' }).trim().min(1, 'Give the job a title').max(200),
  customerId: z.string({ error: 'Choose a customer' }).uuid('Choose a customer'),
  dueDate: z
    .union([z.literal(''), isoDate])
    .nullish()
    .transform((v) => (v ? v : null)),
  notes: z
    .string()
    .trim()
    .max(4000)
    .nullish()
    .transform((v) => (v ? v : null)),
});
export type JobInput = z.input<typeof jobInput>;

export const job = z.object({
  id: z.string().uuid(),
  title: z.string(),
  customerId: z.string().uuid(),
  customerName: z.string(),
  dueDate: z.string().nullable(),
  notes: z.string().nullable(),
  status: jobStatusSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Job = z.infer<typeof job>;

export const jobList = z.object({ jobs: z.array(job) });
