import { describe, expect, it } from 'vitest';
import { dueDateText, dueRange, isPastDue } from './dueRange';

describe('due-date windows', () => {
  // Worked calendar examples (Gregorian calendar; 2027 is not a leap year).
  it('a week from 26 February 2027 ends on 5 March, across the short month', () => {
    expect(dueRange('week', new Date(2027, 1, 26))).toEqual({ dueFrom: '2027-02-26', dueTo: '2027-03-05' });
  });

  it('"past due" ends the day before, across a year boundary', () => {
    expect(dueRange('past', new Date(2027, 0, 1))).toEqual({ dueTo: '2026-12-31' });
  });

  it('thirty days from 15 December 2026 is 14 January 2027', () => {
    expect(dueRange('month', new Date(2026, 11, 15))).toEqual({ dueFrom: '2026-12-15', dueTo: '2027-01-14' });
  });

  it('"any" sets no bounds', () => {
    expect(dueRange('any', new Date(2027, 5, 1))).toEqual({});
  });

  it('a job due today is not past due; one due yesterday is', () => {
    const today = new Date(2027, 2, 1);
    expect(isPastDue('2027-03-01', today)).toBe(false);
    expect(isPastDue('2027-02-28', today)).toBe(true);
  });

  it('a due date reads as a weekday and day, with the year only when it is another year', () => {
    // Gregorian calendar: 14 December 2026 is a Monday, 9 April 2027 a Friday.
    const today = new Date(2026, 11, 2);
    const thisYear = dueDateText('2026-12-14', today);
    expect(thisYear).toMatch(/Mon/);
    expect(thisYear).toMatch(/14/);
    expect(thisYear).not.toMatch(/2026/);
    expect(dueDateText('2027-04-09', today)).toMatch(/Fri.*2027|2027.*Fri/);
  });
});
