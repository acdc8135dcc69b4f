/**
 * Runs `close` once on the first SIGINT or SIGTERM, then exits. A second signal exits at once,
 * so a stuck shutdown never needs more than another Ctrl-C.
 */
export function closeOnSignal(name: string, close: () => Promise<void>): void {
  let closing = false;
  const onSignal = (signal: NodeJS.Signals): void => {
    if (closing) {
      process.exit(1);
    }
    closing = true;
    close().then(
      () => {
        console.log(`${name} stopped (${signal})`);
        process.exit(0);
      },
      (error: unknown) => {
        console.error(`${name} failed to stop cleanly:`, error);
        process.exit(1);
      },
    );
  };
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
}
