import { dueRange, type DueWindow } from './dueRange';
import { openStatuses, type JobListQuery, type JobStatus } from './schema';

/** Jobs the list asks for at a time; later pages follow as the framer scrolls. */
export const JOB_PAGE = 30;

export type JobSort = 'due' | 'created' | 'updated' | 'title';

/** What the framer picked in the job list's filters. */
export interface JobFilterValues {
  q: string;
  status: JobStatus[];
  due: DueWindow;
  sort: JobSort;
  /** Include shipped, collected and cancelled jobs when no status is picked. */
  finished: boolean;
}

/** The list as it opens: the shop's open work, due soonest first. */
export const initialJobFilters: JobFilterValues = { q: '', status: [], due: 'any', sort: 'due', finished: false };

/** The API's list query for the picked filters, with due windows read against `today`. */
export function jobListQueryFor(values: JobFilterValues, today: Date): JobListQuery {
  return {
    q: values.q.trim(),
    // With no status picked, the list is the shop's open work unless finished jobs are asked for.
    status: values.status.length > 0 ? values.status : values.finished ? [] : openStatuses,
    ...dueRange(values.due, today),
    sort: values.sort,
    order: values.sort === 'due' || values.sort === 'title' ? 'asc' : 'desc',
  };
}

/** The API path of one page of the list; only the first page asks for the total. */
export function jobListPath(filters: JobListQuery, offset: number): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) {
    if (value === undefined || value === '' || (Array.isArray(value) && value.length === 0)) continue;
    params.set(key, Array.isArray(value) ? value.join(',') : String(value));
  }
  params.set('limit', String(JOB_PAGE));
  params.set('offset', String(offset));
  if (offset > 0) params.set('count', 'none');
  return `/jobs?${params.toString()}`;
}
