// The whole preview (scale, analysis and 128-key table) for 72-tone scales, the size the designer
// recomputes on every keystroke. Target: under 1 ms median in Node. Run: npx tsx
// bench/tuning-table.bench.ts
import { parsePresetDocument, type ResolvedPreset } from '../shared/preset/preset-document';
import { previewTable } from '../shared/tuning/preview';

function preset(name: string, scale: unknown): ResolvedPreset {
  const parsed = parsePresetDocument({
    format: 'keyloom.preset',
    version: 1,
    name,
    scale,
    mapping: { rootKey: 60 },
  });
  if (!parsed.ok) throw new Error(parsed.errors.map((error) => error.message).join('\n'));
  return parsed.value;
}

const justDegrees = Array.from({ length: 71 }, (_, index) => `${145 + index}/144`);

const cases = [
  preset('72 equal', { kind: 'equal', divisions: 72, period: '2/1' }),
  preset('72 just ratios', { kind: 'list', degrees: justDegrees, period: '2/1' }),
  preset('72 pure fifths', { kind: 'generated', generator: '3/2', up: 40, down: 31 }),
];

const warmUpRuns = 300;
const timedRuns = 2000;

for (const doc of cases) {
  for (let run = 0; run < warmUpRuns; run++) previewTable(doc);
  const times: number[] = [];
  for (let run = 0; run < timedRuns; run++) {
    const start = performance.now();
    previewTable(doc);
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  const median = times[Math.floor(times.length / 2)];
  const slowest = times[Math.floor(times.length * 0.95)];
  const figures = `median ${median.toFixed(3)} ms, 95th percentile ${slowest.toFixed(3)} ms`;
  console.log(`${doc.name.padEnd(16)} ${figures} (${timedRuns} runs)`);
}
