// For specs only: FileReader answers on a later task, which neither fake timers nor whenStable cover.
/** Lets tasks run until `condition` holds (FileReader answers on a later task); fails if it never does. */
export async function until(condition: () => boolean, fixture: { whenStable(): Promise<unknown> }) {
  for (let turn = 0; turn < 100 && !condition(); turn++) {
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
  }
  if (!condition()) throw new Error('the awaited condition never held');
}
