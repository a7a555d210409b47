import { z } from 'zod';

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max)
    .transform((v) => (v === '' ? null : v))
    .nullish()
    .transform((v) => v ?? null);

export const customerInput = z.object({
  name: z.string({ error: 'Enter the customer\'s name' }).trim().min(1, 'Enter the customer\'s name').max(160),
  email: z
    .union([z.literal(''), z.string().trim().toLowerCase().email('Enter an e-mail address like name@example.com')])
    .nullish()
    .transform((v) => (v ? v : null)),
  phone: optionalText(40),
  address: optionalText(500),
  notes: optionalText(4000),
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
  q: z.string().trim().max(200).optional(),
  includeArchived: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
  order: z.enum(customerOrders, { error: 'Order by name or recent' }).default('name'),
});

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

export const customerList = z.object({ customers: z.array(customer) });
