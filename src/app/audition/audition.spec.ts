import { TestBed } from '@angular/core/testing';
import { standInAccess, standInInput } from '../testing/midi-stand-in';
import { DesignState } from '../design/design-state';
import { MidiAccess } from '../hardware/midi-access';
import { Audition } from './audition';
import { ControllerInput } from './controller-input';
import { PlayPanel } from './play-panel';

describe('Audition', () => {
  let audition: Audition;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [DesignState, Audition, MidiAccess, ControllerInput],
    });
    audition = TestBed.inject(Audition);
  });

  it('plays a key at its mapped frequency, and in equal temperament only when comparing', () => {
    // The starting design lays 1/1 9/8 81/64 4/3 3/2 ... on their nearest keys from C4 (key 60): key 67 plays 3/2.
    // arithmetic (MIDI convention): G 3/2 above equal-tempered C4 is 392.4383 Hz, E 81/64 331.1199
    // Hz; equal-tempered G4 (key 67) is 391.9954 Hz.
    expect(audition.hzOfKey(67)).toBeCloseTo(392.4383, 4);
    expect(audition.hzOfKey(64)).toBeCloseTo(331.1199, 4);
    audition.setCompare(true);
    expect(audition.hzOfKey(67)).toBeCloseTo(391.9954, 4);
  });

  it('holds released keys while sustain is on and lets them go with it', () => {
    audition.pressKey(60);
    audition.setSustain(true);
    audition.releaseKey(60);
    expect(audition.playing()).toEqual([60]);
    expect(audition.hasSounded()).toBeTrue();
    audition.setSustain(false);
    expect(audition.playing()).toEqual([]);
  });

  it('plays a controller note-on and note-off by key number, and its sustain pedal', async () => {
    const keyboard = standInInput('in-1', 'Keyboard');
    const access = standInAccess({ inputs: [keyboard] });
    spyOn(navigator, 'requestMIDIAccess').and.returnValue(Promise.resolve(access));
    expect(await TestBed.inject(MidiAccess).open()).toBeTrue();
    const controller = TestBed.inject(ControllerInput);
    controller.choose('in-1');
    // MIDI 1.0 Detailed Specification: 9n kk vv is a note-on, and a note-on at velocity 0 is a
    // note-off; 8n kk vv is a note-off; Bn 40 vv is the damper pedal (controller 64), on from
    // 64 up.
    keyboard.receive([0x90, 64, 100]);
    expect(audition.playing()).toEqual([64]);
    keyboard.receive([0x90, 64, 0]);
    expect(audition.playing()).toEqual([]);
    keyboard.receive([0x93, 60, 90]);
    keyboard.receive([0xb3, 64, 127]);
    keyboard.receive([0x83, 60, 40]);
    expect(audition.playing()).toEqual([60]);
    keyboard.receive([0xb3, 64, 0]);
    expect(audition.playing()).toEqual([]);
    controller.choose(null);
    keyboard.receive([0x90, 62, 100]);
    expect(audition.playing()).toEqual([]);
  });
});

describe('PlayPanel', () => {
  it('plays the home row from the root key, shifts by a period, and stays quiet while typing in a field', async () => {
    TestBed.configureTestingModule({
      providers: [DesignState, Audition, MidiAccess, ControllerInput],
    });
    const fixture = TestBed.createComponent(PlayPanel);
    await fixture.whenStable();
    const audition = TestBed.inject(Audition);
    const press = spyOn(audition, 'pressKey');
    const key = (code: string, type = 'keydown', target: EventTarget = document.body) =>
      target.dispatchEvent(new KeyboardEvent(type, { code, bubbles: true }));
    key('KeyD');
    expect(press).toHaveBeenCalledWith(62);
    key('KeyD', 'keyup');
    // The starting design's seven degrees lie on their nearest keys, twelve keys a period: X moves up by twelve.
    key('KeyX');
    key('KeyA');
    expect(press).toHaveBeenCalledWith(72);
    const field = document.createElement('input');
    document.body.append(field);
    key('KeyS', 'keydown', field);
    field.remove();
    expect(press).toHaveBeenCalledTimes(2);
    await fixture.whenStable();
    expect(fixture.nativeElement.textContent).toContain('play keys 72–94');
  });
});
