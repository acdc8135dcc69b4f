/**
 * Stand-ins for the browser's Web MIDI, for specs: the access object `navigator.requestMIDIAccess`
 * resolves to and its ports, with what webmidi reads and sets on them (id, name, type, state,
 * connection, manufacturer, version, open, close, and the `onstatechange` and `onmidimessage`
 * handlers it assigns).
 */
interface StandInPort {
  id: string;
  name: string;
  type: 'input' | 'output';
  state: 'connected' | 'disconnected';
  connection: 'open' | 'closed' | 'pending';
  manufacturer: string;
  version: string;
  onstatechange: ((event: { port: StandInPort; timeStamp: number }) => void) | null;
  open(): Promise<StandInPort>;
  close(): Promise<StandInPort>;
}

export interface StandInOutput extends StandInPort {
  /** Every message sent, as its bytes. */
  sent: number[][];
  send(bytes: Uint8Array | number[]): void;
}

export interface StandInInput extends StandInPort {
  onmidimessage: ((event: { data: Uint8Array; timeStamp: number }) => void) | null;
  /** Delivers `bytes` from the instrument, as the browser does. */
  receive(bytes: number[] | Uint8Array): void;
}

function port(id: string, name: string, type: 'input' | 'output'): StandInPort {
  const self: StandInPort = {
    id,
    name,
    type,
    state: 'connected',
    connection: 'closed',
    manufacturer: 'Stand-in',
    version: '1',
    onstatechange: null,
    open: async () => ((self.connection = 'open'), self),
    close: async () => ((self.connection = 'closed'), self),
  };
  return self;
}

/** An output port that records what it is sent, and refuses to send once disconnected. */
export function standInOutput(id = 'out-1', name = 'Test synth'): StandInOutput {
  const self: StandInOutput = Object.assign(port(id, name, 'output'), {
    sent: [] as number[][],
    send(bytes: Uint8Array | number[]) {
      if (self.state === 'disconnected') {
        throw new DOMException('The port is closed', 'InvalidStateError');
      }
      self.sent.push(Array.from(bytes));
    },
  });
  return self;
}

export function standInInput(id = 'in-1', name = 'Test synth'): StandInInput {
  const self: StandInInput = Object.assign(port(id, name, 'input'), {
    onmidimessage: null,
    receive(bytes: number[] | Uint8Array) {
      self.onmidimessage?.({ data: Uint8Array.from(bytes), timeStamp: performance.now() });
    },
  });
  return self;
}

/** The access object for these ports; pass it to a spy on `navigator.requestMIDIAccess`. */
export function standInAccess(ports: {
  inputs?: StandInInput[];
  outputs?: StandInOutput[];
}): MIDIAccess {
  return {
    sysexEnabled: true,
    inputs: new Map((ports.inputs ?? []).map((input) => [input.id, input])),
    outputs: new Map((ports.outputs ?? []).map((output) => [output.id, output])),
    onstatechange: null,
  } as unknown as MIDIAccess;
}

/** Plugs `port` in or pulls it out: the browser's statechange on the access and on the port. */
export function plug(
  access: MIDIAccess,
  port: StandInInput | StandInOutput,
  state: StandInPort['state'],
): void {
  const map = port.type === 'input' ? access.inputs : access.outputs;
  const ports = map as unknown as Map<string, StandInPort>;
  ports.set(port.id, port);
  port.state = state;
  // A port that comes back is opened again at once, as webmidi asks; one pulled out waits, pending.
  port.connection = state === 'connected' ? 'open' : 'pending';
  const event = { port, timeStamp: performance.now() };
  (access as unknown as Pick<StandInPort, 'onstatechange'>).onstatechange?.(event);
  port.onstatechange?.(event);
}
