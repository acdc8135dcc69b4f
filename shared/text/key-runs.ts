/** Runs of consecutive keys written compactly: 0, 1, 2, 3, 126, 127 becomes "0-3, 126-127". */
export function keyRuns(keys: readonly number[]): string {
  const runs: [number, number][] = [];
  for (const key of keys) {
    const last = runs[runs.length - 1];
    if (last && last[1] === key - 1) last[1] = key;
    else runs.push([key, key]);
  }
  return runs.map(([first, last]) => (first === last ? `${first}` : `${first}-${last}`)).join(', ');
}
