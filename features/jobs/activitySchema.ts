import { z } from 'zod';

export const activityEntry = z.object({
  id: z.string(),
  kind: z.string(),
  detail: z.record(z.string(), z.unknown()),
  at: z.string(),
  memberName: z.string().nullable(),
});
export type ActivityEntry = z.infer<typeof activityEntry>;

export const activityList = z.object({ activity: z.array(activityEntry) });
