import { describe, expect, it } from 'vitest';
import { inTurns } from './inTurns';

describe('inTurns', () => {
  it('runs the steps in order, each in a task of its own, and resolves after the last', async () => {
    const seen: string[] = [];
    const steps = ['a', 'b', 'c'].map((name) => () => {
      seen.push(name);
      // Work a step queues for later in its task runs before the next step: the steps are separate tasks.
      queueMicrotask(() => seen.push(`${name} done`));
    });
    await inTurns(steps);
    expect(seen).toEqual(['a', 'a done', 'b', 'b done', 'c', 'c done']);
  });

  it('rejects with the first step that throws and runs none after it', async () => {
    const ran: number[] = [];
    const failure = new Error('step two');
    const steps = [() => ran.push(1), () => { throw failure; }, () => ran.push(3)];
    await expect(inTurns(steps)).rejects.toBe(failure);
    expect(ran).toEqual([1]);
  });
});
