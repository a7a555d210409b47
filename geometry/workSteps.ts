/**
 * Work written as a generator that yields between its costly parts (one
 * clipper offset each), so a caller on a page's thread can stop between
 * parts and give the browser a turn. `workDone` runs it to the end at once.
 */
export type WorkSteps<T> = Generator<void, T, void>;

export function workDone<T>(steps: WorkSteps<T>): T {
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
  }
}
