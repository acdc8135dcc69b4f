import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal } from '@angular/core';
import { tuningNameFrom } from '@shared/midi/tuning-name';
import { DesignField } from '../design/design-field';
import { DesignState } from '../design/design-state';
import { typedFrom, typedText } from '../design/draft-document';

/** Where the tuning goes on an instrument: device, tuning program and bank, name, bends and MPE channels. */
@Component({
  selector: 'app-output-settings',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DesignField],
  template: `
    @let output = state.draft().output;
    <fieldset class="fields" [disabled]="state.readOnly()">
      <legend>Instrument</legend>
      <app-design-field
        label="Device id"
        path="output.deviceId"
        inputMode="numeric"
        [value]="text(output.deviceId)"
        (edited)="state.setOutputField('deviceId', typedFrom($event))"
        hint="0-127; 127 reaches every device"
      />
      <app-design-field
        label="Tuning program"
        path="output.program"
        inputMode="numeric"
        [value]="text(output.program)"
        (edited)="state.setOutputField('program', typedFrom($event))"
        hint="0-127; empty means 0"
      />
      <app-design-field
        label="Tuning bank"
        path="output.bank"
        inputMode="numeric"
        [value]="text(output.bank)"
        (edited)="state.setOutputField('bank', typedFrom($event))"
        hint="0-127; empty means 0"
      />
      <app-design-field
        label="Tuning name"
        path="output.tuningName"
        [maxLength]="16"
        [value]="output.tuningName ?? ''"
        [placeholder]="nameFromPreset()"
        (edited)="state.setOutputField('tuningName', $event === '' ? undefined : $event)"
        [hint]="'Up to 16 plain ASCII characters; empty gives ' + nameFromPreset()"
      />
    </fieldset>
    <fieldset class="fields" [disabled]="state.readOnly()">
      <legend>Pitch bend and MPE</legend>
      <app-design-field
        label="Bend range"
        path="output.bendRange"
        inputMode="numeric"
        suffix="semitones"
        [value]="text(output.bendRange)"
        (edited)="state.setOutputField('bendRange', typedFrom($event))"
        hint="1-96; set the instrument to the same range"
      />
      <app-design-field
        label="First member channel"
        path="output.memberChannels[0]"
        inputMode="numeric"
        [value]="text(output.memberChannels?.[0])"
        (edited)="state.setMemberChannel(0, typedFrom($event))"
        hint="1-16"
      />
      <app-design-field
        label="Last member channel"
        path="output.memberChannels[1]"
        inputMode="numeric"
        [value]="text(output.memberChannels?.[1])"
        (edited)="state.setMemberChannel(1, typedFrom($event))"
        hint="1-16, not below the first"
      />
      @if (channelOrderFault(); as fault) {
        <p class="fault" role="alert">Member channels: {{ fault }}</p>
      }
    </fieldset>
    <fieldset class="fields" [disabled]="state.readOnly()">
      <legend>Sampler map (SFZ)</legend>
      <app-design-field
        class="samples"
        label="Samples"
        path="output.samples"
        [value]="samplesText()"
        placeholder="60 middle-c.wav"
        (edited)="editSamples($event)"
        hint="Each the key it was recorded at, then its file: 36 piano-c2.wav, 60 piano-c4.wav. Every key plays the nearest."
      />
    </fieldset>
    <p class="caution">
      <strong>Before you send a file to an instrument:</strong> a tuning dump replaces tuning
      program {{ shownProgram() }} in bank {{ shownBank() }} there. Back up that program first, or
      pick one you do not use.
    </p>
  `,
  styles: `
    :host {
      display: block;
    }
    .fields {
      border: 0;
      padding: 0;
      margin: 0 0 16px;
      display: grid;
      gap: 4px 16px;
      grid-template-columns: repeat(auto-fill, minmax(220px, 1fr));
    }
    legend {
      font: var(--mat-sys-title-small);
      padding: 0;
      margin-bottom: 8px;
    }
    .samples {
      grid-column: 1 / -1;
    }
    .fault {
      grid-column: 1 / -1;
      color: var(--mat-sys-error);
      margin: 0;
      font: var(--mat-sys-body-small);
    }
    .caution {
      max-width: 70ch;
      padding: 12px 16px;
      border-radius: 12px;
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
  `,
})
export class OutputSettings {
  protected readonly state = inject(DesignState);
  protected readonly text = typedText;
  protected readonly typedFrom = typedFrom;
  protected readonly nameFromPreset = computed(() => tuningNameFrom(this.state.draft().name));
  private readonly samples = computed(() => this.state.draft().output.samples ?? [], {
    equal: (a, b) => a === b,
  });
  /** The samples as typed, kept while they still mean what the design holds (a trailing comma, say). */
  protected readonly samplesText = linkedSignal<{ key: unknown; file: string }[], string>({
    source: this.samples,
    computation: (samples, previous) =>
      previous && this.sameSamples(previous.value, samples)
        ? previous.value
        : samples.map((s) => `${s.key} ${s.file}`).join(', '),
  });
  protected readonly shownProgram = computed(() => this.state.shown()?.preset.output.program ?? 0);
  protected readonly shownBank = computed(() => this.state.shown()?.preset.output.bank ?? 0);
  protected editSamples(text: string): void {
    this.samplesText.set(text);
    this.state.setSamples(text);
  }

  private sameSamples(text: string, samples: { key: unknown; file: string }[]): boolean {
    const written = text
      .split(/[,\n]/)
      .map((entry) => entry.trim())
      .filter((entry) => entry !== '');
    return (
      written.length === samples.length &&
      written.every(
        (entry, i) => entry.replace(/\s+/g, ' ') === `${samples[i].key} ${samples[i].file}`,
      )
    );
  }

  /** The one member-channel fault that belongs to neither end alone: the range running downwards. */
  protected readonly channelOrderFault = computed(() =>
    this.state.faults().some((fault) => fault.path === 'output.memberChannels')
      ? this.state.faultAt('output.memberChannels')
      : null,
  );
}
