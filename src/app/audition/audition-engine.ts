/** The sounds the audition synth can make. */
export type Timbre = 'soft' | 'bright' | 'pluck';

/** Master volume the synth starts at: quiet, to spare the listener's hearing. */
export const startingVolumeDb = -24;

/** The last gain after the limiter stays under full scale, so that its overshoot cannot clip. */
const ceilingGain = 0.8;
/** One voice at full velocity: ten of them together drive the limiter hard. */
const voicePeak = 0.3;
const attackSeconds = 0.01;
const releaseSeconds = 0.25;

interface Voice {
  oscillator: OscillatorNode;
  envelope: GainNode;
}

function gainOfDb(db: number): number {
  return 10 ** (db / 20);
}

/**
 * A polyphonic synth over any audio context (the page's, or an offline one in tests): voices with an
 * envelope into a master volume, a limiter (a compressor with a hard, fast knee) and a ceiling gain.
 */
export class AuditionEngine {
  private readonly master: GainNode;
  private readonly voices = new Map<string, Voice>();

  constructor(private readonly context: BaseAudioContext) {
    this.master = context.createGain();
    this.master.gain.value = gainOfDb(startingVolumeDb);
    const limiter = context.createDynamicsCompressor();
    limiter.threshold.value = -10;
    limiter.knee.value = 0;
    limiter.ratio.value = 20;
    limiter.attack.value = 0.001;
    limiter.release.value = 0.1;
    const ceiling = context.createGain();
    ceiling.gain.value = ceilingGain;
    this.master.connect(limiter).connect(ceiling).connect(context.destination);
  }

  setVolumeDb(db: number): void {
    this.master.gain.setTargetAtTime(gainOfDb(db), this.context.currentTime, 0.02);
  }

  /** Starts a voice named `id` at exactly `hz`; a voice already sounding under that name is released first. */
  start(id: string, hz: number, timbre: Timbre, at = this.context.currentTime): void {
    this.stop(id, at);
    const oscillator = this.context.createOscillator();
    oscillator.type = timbre === 'soft' ? 'sine' : timbre === 'bright' ? 'sawtooth' : 'triangle';
    oscillator.frequency.value = hz;
    const envelope = this.context.createGain();
    envelope.gain.setValueAtTime(0, at);
    envelope.gain.linearRampToValueAtTime(voicePeak, at + attackSeconds);
    if (timbre === 'pluck') envelope.gain.setTargetAtTime(0, at + attackSeconds, 0.35);
    else envelope.gain.setTargetAtTime(voicePeak * 0.7, at + attackSeconds, 0.15);
    let source: AudioNode = oscillator;
    if (timbre !== 'soft') {
      const filter = this.context.createBiquadFilter();
      filter.type = 'lowpass';
      filter.Q.value = timbre === 'bright' ? 2 : 0.7;
      const cutoff = Math.min(hz * (timbre === 'bright' ? 6 : 10), 12000);
      filter.frequency.setValueAtTime(cutoff, at);
      if (timbre === 'pluck') filter.frequency.setTargetAtTime(Math.min(hz * 1.5, cutoff), at, 0.2);
      source = oscillator.connect(filter);
    }
    source.connect(envelope).connect(this.master);
    oscillator.start(at);
    this.voices.set(id, { oscillator, envelope });
  }

  /** Releases the voice named `id`, if it sounds. */
  stop(id: string, at = this.context.currentTime): void {
    const voice = this.voices.get(id);
    if (!voice) return;
    this.voices.delete(id);
    voice.envelope.gain.cancelAndHoldAtTime(at);
    voice.envelope.gain.setTargetAtTime(0, at, releaseSeconds / 4);
    voice.oscillator.stop(at + releaseSeconds * 2);
  }

  sounding(): string[] {
    return [...this.voices.keys()];
  }
}
