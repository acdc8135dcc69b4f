import { DestroyRef, Injectable, inject, signal } from '@angular/core';
import {
  type FrameReader,
  type HeardFrame,
  firstSound,
  frameLengthFor,
  pitchReader,
} from '@shared/tuner/pitch-detector';
import { type PitchTrack, followPitch, silentTrack } from '@shared/tuner/pitch-track';

/** Where listening stands: not yet, asking the browser, listening, or why it cannot. */
export type ListeningState =
  'idle' | 'asking' | 'listening' | 'refused' | 'no-input' | 'busy' | 'ended' | 'unsupported';

/** The performance mark of a sound starting after quiet, which the benchmark reads (bench/tuner.bench.ts). */
const onsetMark = 'keyloom:tuner-onset';

/** The browser's refusal, by the DOMException's name, as a state. */
function refusalState(error: unknown): ListeningState {
  const name = error instanceof DOMException || error instanceof Error ? error.name : '';
  if (name === 'NotAllowedError' || name === 'SecurityError') return 'refused';
  if (name === 'NotFoundError' || name === 'OverconstrainedError') return 'no-input';
  return 'busy';
}

/**
 * The microphone, heard: asks for it only when `start` is called, then reads one frame of the analyser's most
 * recent sound at every screen refresh (shared/tuner: the McLeod pitch method, and the reading smoothed over
 * the frames that agree) and offers the steady pitch. The browser's own echo cancelling, noise suppression and
 * gain control are turned off: they bend a held tone.
 */
@Injectable()
export class PitchListener {
  readonly state = signal<ListeningState>('idle');
  /** The steady pitch heard, in Hz; null while there is no clear pitch or no listening. */
  readonly hz = signal<number | null>(null);
  /** What the last frame held: a pitch, too little sound, or sound with no clear pitch. */
  readonly lastFrame = signal<HeardFrame['kind'] | null>(null);

  private stream: MediaStream | null = null;
  private context: AudioContext | null = null;
  private analyser: AnalyserNode | null = null;
  private samples = new Float32Array(0);
  private read: FrameReader | null = null;
  private track: PitchTrack = silentTrack;
  private animation = 0;
  private sounding = false;
  private wakeLock: WakeLockSentinel | null = null;
  /** Counts starts, so that a start overtaken by a stop (or another start) lets its stream go. */
  private attempt = 0;

  constructor() {
    inject(DestroyRef).onDestroy(() => this.stop());
  }

  /** Asks for the microphone (the browser may ask the player) and starts listening. */
  async start(): Promise<void> {
    if (this.state() === 'asking' || this.state() === 'listening') return;
    const devices = navigator.mediaDevices;
    if (!devices?.getUserMedia) {
      this.state.set('unsupported');
      return;
    }
    const attempt = ++this.attempt;
    this.state.set('asking');
    // The audio context is made while the press that started this still counts as the player's gesture: some
    // browsers keep a context made later silent.
    const context = new AudioContext();
    void context.resume();
    let stream: MediaStream;
    try {
      stream = await devices.getUserMedia({
        audio: { echoCancellation: false, noiseSuppression: false, autoGainControl: false },
      });
    } catch (error) {
      void context.close();
      if (attempt === this.attempt) this.state.set(refusalState(error));
      return;
    }
    if (attempt !== this.attempt) {
      void context.close();
      for (const track of stream.getTracks()) track.stop();
      return;
    }
    this.listenTo(stream, context);
  }

  /** Stops listening and lets the microphone go. */
  stop(): void {
    this.attempt++;
    this.release();
    this.state.set('idle');
  }

  private listenTo(stream: MediaStream, context: AudioContext): void {
    const analyser = context.createAnalyser();
    analyser.fftSize = frameLengthFor(context.sampleRate);
    context.createMediaStreamSource(stream).connect(analyser);
    for (const track of stream.getAudioTracks()) {
      track.addEventListener('ended', () => {
        if (this.stream !== stream) return;
        this.release();
        this.state.set('ended');
      });
    }
    this.stream = stream;
    this.context = context;
    this.analyser = analyser;
    this.samples = new Float32Array(analyser.fftSize);
    this.read = pitchReader(analyser.fftSize);
    this.track = silentTrack;
    this.sounding = false;
    this.state.set('listening');
    this.animation = requestAnimationFrame(() => this.hearFrame());
    void this.keepScreenOn();
  }

  /** Keeps a phone's screen from dimming while it listens, where the browser allows it; else nothing. */
  private async keepScreenOn(): Promise<void> {
    try {
      const lock = await navigator.wakeLock?.request('screen');
      if (this.state() === 'listening') this.wakeLock = lock ?? null;
      else void lock?.release();
    } catch {
      // Refused (a hidden page, a saving mode): the screen follows its own settings.
    }
  }

  private hearFrame(): void {
    const { analyser, context, read } = this;
    if (!analyser || !context || !read) return;
    analyser.getFloatTimeDomainData(this.samples);
    const heard = read(this.samples, context.sampleRate);
    this.markOnset(heard, context.sampleRate);
    this.track = followPitch(this.track, heard);
    this.lastFrame.set(heard.kind);
    this.hz.set(this.track.hz);
    this.animation = requestAnimationFrame(() => this.hearFrame());
  }

  /**
   * Marks where a sound starts after quiet: the first sample above the quiet threshold, dated back from now by
   * the samples that follow it in the frame.
   */
  private markOnset(heard: HeardFrame, sampleRate: number): void {
    const sounding = heard.kind !== 'quiet';
    if (sounding && !this.sounding && this.track.hz === null) {
      const after = this.samples.length - Math.max(0, firstSound(this.samples));
      performance.mark(onsetMark, { startTime: performance.now() - (1000 * after) / sampleRate });
    }
    this.sounding = sounding;
  }

  private release(): void {
    cancelAnimationFrame(this.animation);
    for (const track of this.stream?.getTracks() ?? []) track.stop();
    void this.context?.close();
    void this.wakeLock?.release();
    this.wakeLock = null;
    this.stream = null;
    this.context = null;
    this.analyser = null;
    this.read = null;
    this.track = silentTrack;
    this.hz.set(null);
    this.lastFrame.set(null);
  }
}
