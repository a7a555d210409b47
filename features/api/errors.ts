import { z } from 'zod';

/** The one shape every API error has on the wire. */
export const errorBody = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
    /** The server's id for the request, also in its log lines and the X-Request-Id header. */
    requestId: z.string().optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBody>;
