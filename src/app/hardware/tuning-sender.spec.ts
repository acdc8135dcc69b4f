import { TestBed } from '@angular/core/testing';
import { renderExport } from '@shared/export/export-catalogue';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import { DesignState } from '../design/design-state';
import { LiveFollow, followDebounceMs } from './live-follow';
import { MidiAccess, midiAccessFaults } from './midi-access';
import { TuningSender } from './tuning-sender';
import {
  type StandInOutput,
  plug,
  standInAccess,
  standInInput,
  standInOutput,
} from '../testing/midi-stand-in';

describe('TuningSender and LiveFollow', () => {
  let port: StandInOutput;
  let access: MIDIAccess;
  let sender: TuningSender;
  let state: DesignState;
  let request: jasmine.Spy;

  beforeEach(async () => {
    port = standInOutput();
    access = standInAccess({ outputs: [port] });
    request = spyOn(navigator, 'requestMIDIAccess').and.callFake(() => Promise.resolve(access));
    TestBed.configureTestingModule({
      providers: [DesignState, MidiAccess, TuningSender, LiveFollow],
    });
    state = TestBed.inject(DesignState);
    sender = TestBed.inject(TuningSender);
    expect(await TestBed.inject(MidiAccess).open()).toBeTrue();
    sender.outputId.set('out-1');
  });

  it('asks for MIDI with system exclusive and lists the output', () => {
    expect(request).toHaveBeenCalledWith(jasmine.objectContaining({ sysex: true }));
    expect(TestBed.inject(MidiAccess).outputs()).toEqual([{ id: 'out-1', name: 'Test synth' }]);
  });

  it('asks the browser once, and keeps the port lists as devices come and go', async () => {
    const midi = TestBed.inject(MidiAccess);
    expect(await midi.open()).toBeTrue();
    expect(request).toHaveBeenCalledTimes(1);
    const keyboard = standInInput('in-2', 'Keyboard');
    plug(access, keyboard, 'connected');
    expect(midi.inputs()).toEqual([{ id: 'in-2', name: 'Keyboard' }]);
    plug(access, port, 'disconnected');
    expect(midi.outputs()).toEqual([]);
    expect(midi.output('out-1')).toBeNull();
    plug(access, port, 'connected');
    expect(midi.outputs()).toEqual([{ id: 'out-1', name: 'Test synth' }]);
    expect(sender.sendNow(Uint8Array.of(0xf0, 0x7e, 0x7f, 0x08, 0x00, 0x00, 0xf7))).toBeTrue();
  });

  it('sends the bytes of the bulk dump export, with the cable pause by default', async () => {
    const preset = state.shown()!.preset;
    const exported = renderExport(preset, 'mts-bulk');
    expect(sender.pauseMs()).toBeCloseTo(130.56, 2);
    sender.pauseMs.set(0);
    expect(await sender.send()).toBeTrue();
    expect(port.sent.flat()).toEqual(exported.ok ? [...exported.value.bytes] : []);
    expect(sender.progress()).toEqual({ sent: 1, total: 1 });
    expect(sender.done()).toBe('Sent 1 message (408 bytes).');
  });

  it('says so when the port disappears in the middle of a send', async () => {
    sender.form.set('mts-notes');
    sender.pauseMs.set(0);
    spyOn(port, 'send').and.callFake((bytes: Uint8Array | number[]) => {
      port.sent.push([...bytes]);
      port.state = 'disconnected';
    });
    expect(await sender.send()).toBeFalse();
    expect(port.sent.length).toBe(1);
    expect(sender.fault()).toContain('The MIDI port disappeared while sending');
  });

  it(
    'live follow sends only the keys whose pitch changed, and counts them',
    async () => {
      const follow = TestBed.inject(LiveFollow);
      follow.start();
      state.setMappingField('rootHz', 262);
      TestBed.tick();
      // A settled edit goes out in one go, so the first message means all of them are there.
      await waitFor(
        `the changed keys, sent ${followDebounceMs} ms after the edit`,
        () => port.sent.length > 0,
      );
      const changedKeys = port.sent.reduce((count, message) => count + message[6], 0);
      const mapped = state.shown()!.table.keys.filter((key) => key.hz !== null).length;
      expect(changedKeys).toBe(mapped);
      port.sent = [];
      state.setScaleField('up', 6);
      TestBed.tick();
      await waitFor(
        `the keys the next edit changed, sent ${followDebounceMs} ms after it`,
        () => port.sent.length > 0,
      );
      expect(port.sent.length).toBeGreaterThan(0);
      const keys = port.sent.flatMap((message) =>
        Array.from({ length: message[6] }, (_, index) => message[7 + 4 * index]),
      );
      expect(keys.length).toBeLessThan(mapped);
      expect(follow.messagesSent()).toBeGreaterThan(port.sent.length);
      expect(follow.bytesSent()).toBeGreaterThan(0);
    },
    patientSpecMs,
  );
});

describe('MidiAccess', () => {
  it('explains a refusal', async () => {
    const denied = new DOMException('denied', 'SecurityError');
    spyOn(navigator, 'requestMIDIAccess').and.callFake(() => Promise.reject(denied));
    const refused = new MidiAccess();
    expect(await refused.open()).toBeFalse();
    expect(refused.state()).toBe('refused');
    expect(midiAccessFaults.refused).toContain('refused access to MIDI');
  });

  it('explains a browser without Web MIDI', async () => {
    // Hides the browser's own requestMIDIAccess (on Navigator.prototype) behind an own property.
    Object.defineProperty(navigator, 'requestMIDIAccess', { configurable: true, value: undefined });
    try {
      const missing = new MidiAccess();
      expect(await missing.open()).toBeFalse();
      expect(missing.state()).toBe('unsupported');
      expect(midiAccessFaults.unsupported).toContain('no Web MIDI');
    } finally {
      delete (navigator as Partial<Navigator>).requestMIDIAccess;
    }
  });
});
