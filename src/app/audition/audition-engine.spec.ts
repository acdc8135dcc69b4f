import { AuditionEngine } from './audition-engine';

const sampleRate = 48000;

/**
 * The fundamental of a steady tone from its upward zero crossings, each placed between samples by
 * linear interpolation: (crossings - 1) periods over the time from the first to the last.
 */
function measuredHz(samples: Float32Array, fromSecond: number): number {
  const crossings: number[] = [];
  for (let index = Math.floor(fromSecond * sampleRate); index < samples.length - 1; index++) {
    const [a, b] = [samples[index], samples[index + 1]];
    if (a < 0 && b >= 0) crossings.push(index + a / (a - b));
  }
  return ((crossings.length - 1) * sampleRate) / (crossings.at(-1)! - crossings[0]);
}

function centsBetween(hz: number, reference: number): number {
  return 1200 * Math.log2(hz / reference);
}

async function render(
  seconds: number,
  play: (engine: AuditionEngine) => void,
): Promise<Float32Array> {
  const context = new OfflineAudioContext(1, seconds * sampleRate, sampleRate);
  play(new AuditionEngine(context));
  return (await context.startRendering()).getChannelData(0);
}

describe('AuditionEngine', () => {
  it('sounds a soft note at its mapped frequency within 0.1 cents', async () => {
    // arithmetic (MIDI convention): a just fifth above equal-tempered C4 is 392.4383 Hz (3/2 x
    // 261.6255653006).
    const mappedHz = 261.6255653006 * 1.5;
    const samples = await render(4, (engine) => engine.start('fifth', mappedHz, 'soft', 0));
    const errorCents = centsBetween(measuredHz(samples, 0.5), mappedHz);
    console.log(
      `audition pitch error: ${errorCents.toFixed(5)} cents at ${mappedHz.toFixed(4)} Hz`,
    );
    expect(Math.abs(errorCents)).toBeLessThan(0.1);
  });

  it('sounds a low and a high mapped key within 0.1 cents too', async () => {
    for (const mappedHz of [55.3, 1760 * 2 ** (13.686 / 1200)]) {
      const samples = await render(3, (engine) => engine.start('key', mappedHz, 'soft', 0));
      expect(Math.abs(centsBetween(measuredHz(samples, 0.5), mappedHz)))
        .withContext(`${mappedHz} Hz`)
        .toBeLessThan(0.1);
    }
  });

  it('keeps ten loud bright voices under full scale through the limiter', async () => {
    const samples = await render(2, (engine) => {
      engine.setVolumeDb(0);
      for (let voice = 0; voice < 10; voice++)
        engine.start(`voice ${voice}`, 110 * 2 ** (voice / 5), 'bright', 0);
    });
    const peak = samples.reduce((highest, sample) => Math.max(highest, Math.abs(sample)), 0);
    console.log(
      `audition limiter peak with ten voices at 0 dB: ${peak.toFixed(4)} (${(20 * Math.log10(peak)).toFixed(2)} dBFS)`,
    );
    expect(peak).toBeGreaterThan(0.1);
    expect(peak).toBeLessThan(1);
  });

  it('starts quiet and falls silent after a release', async () => {
    const samples = await render(2, (engine) => {
      engine.start('note', 440, 'pluck', 0);
      engine.stop('note', 0.5);
    });
    const peakOf = (from: number, to: number) =>
      samples
        .subarray(from * sampleRate, to * sampleRate)
        .reduce((highest, sample) => Math.max(highest, Math.abs(sample)), 0);
    expect(peakOf(0, 0.5)).toBeGreaterThan(0);
    expect(peakOf(0, 0.5)).toBeLessThan(0.1);
    expect(peakOf(1.5, 2)).toBeLessThan(1e-4);
  });
});
