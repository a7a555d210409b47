import { z } from 'zod';
import { optionalTextField, textField } from '../text/schema';


export const customerInput = z.object({
  name: textField({ max: 160, required: 'Enter the customer\'s name' }),
  email: z
    .union([z.literal(''), textField({ max: 254 }).toLowerCase().email('Enter an e-mail address like name@example.com')])
    .nullish()
    .transform((v) => (v ? v : null)),
  phone: optionalTextField({ max: 40 }),
  address: optionalTextField({ max: 500, multiline: true }),
  notes: optionalTextField({ max: 4000, multiline: true }),
});
export type CustomerInput = z.input<typeof customerInput>;

export const customerUpdate = customerInput
  .partial()
  .extend({ archived: z.boolean().optional() })
  .refine((v) => Object.keys(v).length > 0, { message: 'Change at least one field' });
export type CustomerUpdate = z.input<typeof customerUpdate>;

/** How a customer list is ordered: by name (the customers screen) or newest first (choosing one for a new job). */
export const customerOrders = ['name', 'recent'] as const;
export type CustomerOrder = (typeof customerOrders)[number];

export const customerListQuery = z.object({
  q: textField({ max: 200 }).optional(),
  includeArchived: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
  order: z.enum(customerOrders, { error: 'Order by name or recent' }).default('name'),
  limit: z.coerce.number().int().min(1).max(100).default(50),
  offset: z.coerce.number().int().min(0).max(100_000).default(0),
  /** Count every match ("exact") or not ("none"); by default only the first page is counted. */
  count: z.enum(['exact', 'none']).optional(),
});
export type CustomerListQuery = z.output<typeof customerListQuery>;

export const customer = z.object({
  id: z.string().uuid(),
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  address: z.string().nullable(),
  notes: z.string().nullable(),
  archivedAt: z.string().nullable(),
  createdAt: z.string(),
});
export type Customer = z.infer<typeof customer>;

/** One page of customers; `total` is null when the count was not asked for (pages after the first). */
export const customerList = z.object({ customers: z.array(customer), total: z.number().int().nullable() });
