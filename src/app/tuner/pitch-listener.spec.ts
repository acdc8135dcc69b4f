import { Injector, runInInjectionContext } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import { PitchListener } from './pitch-listener';

/**
 * A microphone that plays a steady tone: an oscillator of an audio context of its own, as a media stream. The
 * spec stands in for getUserMedia with it, as the browser would hand over a microphone's stream.
 */
function toneMicrophone(hz: number): { stream: MediaStream; close: () => Promise<void> } {
  const context = new AudioContext();
  void context.resume();
  const oscillator = new OscillatorNode(context, { frequency: hz });
  const gain = new GainNode(context, { gain: 0.3 });
  const destination = context.createMediaStreamDestination();
  oscillator.connect(gain).connect(destination);
  oscillator.start();
  return { stream: destination.stream, close: () => context.close() };
}

describe('PitchListener', () => {
  let listener: PitchListener;
  let injector: Injector;

  beforeEach(() => {
    injector = TestBed.inject(Injector);
    listener = runInInjectionContext(injector, () => new PitchListener());
  });

  afterEach(() => listener.stop());

  it(
    'asks for the microphone only on start, then hears a 440 Hz tone as 440 Hz',
    async () => {
      const microphone = toneMicrophone(440);
      const ask = spyOn(navigator.mediaDevices, 'getUserMedia').and.resolveTo(microphone.stream);
      expect(ask).not.toHaveBeenCalled();
      await listener.start();
      expect(ask).toHaveBeenCalledOnceWith({
        audio: { echoCancellation: false, noiseSuppression: false, autoGainControl: false },
      });
      expect(listener.state()).toBe('listening');
      const hz = await waitFor('a steady reading', () => listener.hz());
      // An oscillator's frequency is exact; the tuner's accuracy target is 0.5 cents (1/1200 octave each).
      expect(Math.abs(1200 * Math.log2(hz / 440))).toBeLessThan(0.5);
      expect(listener.lastFrame()).toBe('pitch');

      listener.stop();
      expect(listener.state()).toBe('idle');
      expect(listener.hz()).toBeNull();
      expect(
        microphone.stream.getTracks().every((track) => track.readyState === 'ended'),
      ).toBeTrue();
      await microphone.close();
    },
    patientSpecMs,
  );

  it(
    'hears silence as quiet, with no reading',
    async () => {
      const silent = new AudioContext();
      spyOn(navigator.mediaDevices, 'getUserMedia').and.resolveTo(
        silent.createMediaStreamDestination().stream,
      );
      await listener.start();
      expect(await waitFor('a frame heard', () => listener.lastFrame())).toBe('quiet');
      expect(listener.hz()).toBeNull();
      await silent.close();
    },
    patientSpecMs,
  );

  for (const [name, state] of [
    ['NotAllowedError', 'refused'],
    ['SecurityError', 'refused'],
    ['NotFoundError', 'no-input'],
    ['NotReadableError', 'busy'],
  ] as const) {
    it(`turns the browser's ${name} into "${state}"`, async () => {
      spyOn(navigator.mediaDevices, 'getUserMedia').and.rejectWith(new DOMException('no', name));
      await listener.start();
      expect(listener.state()).toBe(state);
      expect(listener.hz()).toBeNull();
    });
  }

  it('says when the browser offers no microphone at all', async () => {
    const mediaDevices = Object.getOwnPropertyDescriptor(Navigator.prototype, 'mediaDevices')!;
    Object.defineProperty(navigator, 'mediaDevices', { configurable: true, value: undefined });
    try {
      await listener.start();
      expect(listener.state()).toBe('unsupported');
    } finally {
      delete (navigator as { mediaDevices?: unknown }).mediaDevices;
    }
    expect(Object.getOwnPropertyDescriptor(Navigator.prototype, 'mediaDevices')).toEqual(
      mediaDevices,
    );
  });

  it(
    'says when the microphone goes away while listening',
    async () => {
      const microphone = toneMicrophone(220);
      spyOn(navigator.mediaDevices, 'getUserMedia').and.resolveTo(microphone.stream);
      await listener.start();
      const [track] = microphone.stream.getAudioTracks();
      // A track ends when its device goes; stop() on the track does not fire "ended", so the spec fires it.
      track.dispatchEvent(new Event('ended'));
      expect(listener.state()).toBe('ended');
      expect(listener.hz()).toBeNull();
      await microphone.close();
    },
    patientSpecMs,
  );
});
