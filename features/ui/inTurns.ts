/**
 * Runs each step in a browser task of its own, so the page can answer a tap and paint between
 * them; resolves once the last has run, rejects with the first step that throws (the rest are
 * not run). A message to ourselves is the quickest way to give the browser a turn: unlike a
 * timer it is never held back to 4 ms when one follows another. No imports: the app's entry
 * uses it before anything else is evaluated.
 */
export function inTurns(steps: ReadonlyArray<() => unknown>): Promise<void> {
  return new Promise((resolve, reject) => {
    const turns = new MessageChannel();
    let next = 0;
    turns.port1.onmessage = () => {
      try {
        if (next < steps.length) {
          steps[next]!();
          next += 1;
          turns.port2.postMessage(null);
          return;
        }
        turns.port1.close();
        resolve();
      } catch (error) {
        turns.port1.close();
        reject(error);
      }
    };
    turns.port2.postMessage(null);
  });
}
