/** How long waitFor keeps looking: enough for a page to answer on a machine whose cores are all busy. */
const waitLimitMs = 20_000;

/** A spec's own time limit when it uses waitFor: longer than waitFor's, so that waitFor's message is the one reported. */
export const patientSpecMs = 30_000;

/**
 * Waits for a page's own signal instead of a fixed time: checks `condition` every 10 ms, running `step`
 * (change detection, say) before each check, and returns the first truthy value it gives. Fails the spec,
 * naming `what` it waited for, when nothing came within 20 seconds.
 */
export async function waitFor<T>(
  what: string,
  condition: () => T,
  step: () => unknown = () => undefined,
): Promise<NonNullable<T>> {
  const deadline = performance.now() + waitLimitMs;
  for (;;) {
    const seen = condition();
    if (seen) return seen as NonNullable<T>;
    if (performance.now() > deadline)
      throw new Error(`Waited ${waitLimitMs} ms for ${what}, in vain.`);
    await new Promise((resolve) => setTimeout(resolve, 10));
    await step();
  }
}
