import { calendarDayText } from '../ui/dates';

/** Quick due-date windows for the job list, read against the shop's local calendar day. */
export type DueWindow = 'any' | 'past' | 'week' | 'month';

export const dueWindowLabels: Record<DueWindow, string> = {
  any: 'Any due date',
  past: 'Past due date',
  week: 'Due within 7 days',
  month: 'Due within 30 days',
};

function isoDay(date: Date): string {
  const y = date.getFullYear();
  const m = String(date.getMonth() + 1).padStart(2, '0');
  const d = String(date.getDate()).padStart(2, '0');
  return `${y}-${m}-${d}`;
}

function addDays(date: Date, days: number): Date {
  const next = new Date(date);
  next.setDate(next.getDate() + days);
  return next;
}

/** The `dueFrom`/`dueTo` filter for a window; "past" ends yesterday, the others start today. */
export function dueRange(window: DueWindow, today: Date): { dueFrom?: string; dueTo?: string } {
  switch (window) {
    case 'past':
      return { dueTo: isoDay(addDays(today, -1)) };
    case 'week':
      return { dueFrom: isoDay(today), dueTo: isoDay(addDays(today, 7)) };
    case 'month':
      return { dueFrom: isoDay(today), dueTo: isoDay(addDays(today, 30)) };
    default:
      return {};
  }
}

/** True when a due date (YYYY-MM-DD) is before today's calendar day. */
export function isPastDue(dueDate: string, today: Date): boolean {
  return dueDate < isoDay(today);
}

/** A due date (YYYY-MM-DD) as people say it, "Sat, Dec 5", with the year when it is not this one. */
export function dueDateText(isoDate: string, today: Date): string {
  return calendarDayText(isoDate, Number(isoDate.slice(0, 4)) !== today.getFullYear());
}
