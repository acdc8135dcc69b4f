import { ChangeDetectionStrategy, Component, OnInit, input, output } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, type ValidatorFn } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import {
  type InstrumentSettings,
  type ReceiveForm,
  instrumentSettings,
  receiveForms,
} from '@shared/api/instruments';
import { parseRequest } from '@shared/api/requests';
import { requestFieldValidator } from '../bands/request-validator';
import { receiveFormLabels } from './my-instruments';

/**
 * The member channels are checked as a pair, through the whole schema (the order of the two is a check on the
 * object): `index` 0 is the first channel, 1 the last, which also carries the fault of their order.
 */
function channelValidator(index: 0 | 1, subject: string): ValidatorFn {
  return (control) => {
    const group = control.parent as FormGroup | null;
    if (!group) return null;
    const channels = [group.get('firstChannel')!.value, group.get('lastChannel')!.value];
    const result = parseRequest(instrumentSettings, {
      name: 'check',
      receives: 'mts-bulk',
      memberChannels: channels,
    });
    if (result.ok) return null;
    const own = result.errors.find((error) => error.path === `memberChannels[${index}]`);
    if (own) return { request: `${subject} ${own.message.slice(own.path.length + 2)}.` };
    const order =
      index === 1 ? result.errors.find((error) => error.path === 'memberChannels') : undefined;
    return order
      ? { request: `The channel range ${order.message.slice(order.path.length + 2)}.` }
      : null;
  };
}

const numberControl = (value: number, validator: ValidatorFn) =>
  new FormControl<number | null>(value, { validators: validator });

/** An instrument's settings, each field checked by the shared schema as the server checks it. */
@Component({
  selector: 'app-instrument-form',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
  ],
  template: `
    <form
      class="instrument-form"
      [formGroup]="form"
      (ngSubmit)="submit()"
      [attr.aria-label]="label()"
    >
      <mat-form-field class="wide" subscriptSizing="dynamic">
        <mat-label>Instrument name</mat-label>
        <input matInput formControlName="name" autocomplete="off" />
        <mat-error>{{ fault('name') }}</mat-error>
      </mat-form-field>
      <mat-form-field class="wide" subscriptSizing="dynamic">
        <mat-label>Takes a tuning as</mat-label>
        <mat-select formControlName="receives">
          @for (form of forms; track form) {
            <mat-option [value]="form">{{ formLabels[form] }}</mat-option>
          }
        </mat-select>
        <mat-error>{{ fault('receives') }}</mat-error>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Device id</mat-label>
        <input matInput type="number" formControlName="deviceId" inputmode="numeric" />
        <mat-hint>0-127; 127 reaches every device</mat-hint>
        <mat-error>{{ fault('deviceId') }}</mat-error>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Tuning program</mat-label>
        <input matInput type="number" formControlName="program" inputmode="numeric" />
        <mat-error>{{ fault('program') }}</mat-error>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Tuning bank</mat-label>
        <input matInput type="number" formControlName="bank" inputmode="numeric" />
        <mat-error>{{ fault('bank') }}</mat-error>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Bend range</mat-label>
        <input matInput type="number" formControlName="bendRange" inputmode="numeric" />
        <span matTextSuffix>semitones</span>
        <mat-error>{{ fault('bendRange') }}</mat-error>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>First member channel</mat-label>
        <input matInput type="number" formControlName="firstChannel" inputmode="numeric" />
        <mat-hint>For MPE and bend tables</mat-hint>
        <mat-error>{{ fault('firstChannel') }}</mat-error>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Last member channel</mat-label>
        <input matInput type="number" formControlName="lastChannel" inputmode="numeric" />
        <mat-error>{{ fault('lastChannel') }}</mat-error>
      </mat-form-field>
      <mat-form-field class="wide" subscriptSizing="dynamic">
        <mat-label>MIDI output port</mat-label>
        <input matInput formControlName="port" autocomplete="off" />
        <mat-hint
          >Its name as the browser lists it, to send to it directly; may stay empty</mat-hint
        >
        <mat-error>{{ fault('port') }}</mat-error>
      </mat-form-field>
      <div class="actions">
        <button mat-button type="button" (click)="cancelled.emit()">Cancel</button>
        <button mat-flat-button type="submit" [disabled]="busy()">{{ submitLabel() }}</button>
      </div>
    </form>
  `,
  styles: `
    .instrument-form {
      display: grid;
      gap: 12px;
      grid-template-columns: repeat(auto-fill, minmax(150px, 1fr));
    }
    .wide,
    .actions {
      grid-column: 1 / -1;
    }
    .actions {
      display: flex;
      justify-content: flex-end;
      flex-wrap: wrap;
      gap: 8px;
    }
  `,
})
export class InstrumentForm implements OnInit {
  /** The instrument to change; null for a new one. */
  readonly instrument = input<InstrumentSettings | null>(null);
  /** The form's accessible name. */
  readonly label = input('Instrument');
  readonly submitLabel = input('Add instrument');
  readonly busy = input(false);
  readonly saved = output<InstrumentSettings>();
  readonly cancelled = output<void>();

  protected readonly forms = receiveForms;
  protected readonly formLabels = receiveFormLabels;
  protected readonly form = new FormGroup({
    name: new FormControl('', {
      nonNullable: true,
      validators: requestFieldValidator(instrumentSettings, 'name', 'The instrument name'),
    }),
    receives: new FormControl<ReceiveForm>('mts-bulk', {
      nonNullable: true,
      validators: requestFieldValidator(instrumentSettings, 'receives', 'The tuning form'),
    }),
    deviceId: numberControl(
      127,
      requestFieldValidator(instrumentSettings, 'deviceId', 'The device id'),
    ),
    program: numberControl(
      0,
      requestFieldValidator(instrumentSettings, 'program', 'The tuning program'),
    ),
    bank: numberControl(0, requestFieldValidator(instrumentSettings, 'bank', 'The tuning bank')),
    bendRange: numberControl(
      2,
      requestFieldValidator(instrumentSettings, 'bendRange', 'The bend range'),
    ),
    firstChannel: numberControl(2, channelValidator(0, 'The first member channel')),
    lastChannel: numberControl(16, channelValidator(1, 'The last member channel')),
    port: new FormControl('', {
      nonNullable: true,
      validators: requestFieldValidator(instrumentSettings, 'port', 'The port name'),
    }),
  });

  constructor() {
    // The order of the two channels is a fault of the last one: it is checked again when the first changes.
    this.form.controls.firstChannel.valueChanges.subscribe(() =>
      this.form.controls.lastChannel.updateValueAndValidity({ emitEvent: false }),
    );
  }

  ngOnInit(): void {
    const instrument = this.instrument();
    if (!instrument) return;
    const { name, receives, deviceId, program, bank, bendRange, port } = instrument;
    const [firstChannel, lastChannel] = instrument.memberChannels;
    this.form.setValue({
      name,
      receives,
      deviceId,
      program,
      bank,
      bendRange,
      firstChannel,
      lastChannel,
      port: port ?? '',
    });
  }

  protected fault(field: string): string {
    return (this.form.get(field)?.errors?.['request'] as string | undefined) ?? '';
  }

  protected submit(): void {
    this.form.markAllAsTouched();
    this.form.controls.lastChannel.updateValueAndValidity();
    if (this.form.invalid) return;
    const { firstChannel, lastChannel, port, ...rest } = this.form.getRawValue();
    const parsed = instrumentSettings.safeParse({
      ...rest,
      memberChannels: [firstChannel, lastChannel],
      port: port.trim() || null,
    });
    if (parsed.success) this.saved.emit(parsed.data);
  }
}
