/**
 * The computer keyboard as a playing surface: the home row and the row above it play consecutive
 * MIDI keys (A S D F … ' then Q W E R … ]), and Z / X move the range down / up by a period.
 */
const playingRows = [
  ['KeyA', 'KeyS', 'KeyD', 'KeyF', 'KeyG', 'KeyH', 'KeyJ', 'KeyK', 'KeyL', 'Semicolon', 'Quote'],
  [
    'KeyQ',
    'KeyW',
    'KeyE',
    'KeyR',
    'KeyT',
    'KeyY',
    'KeyU',
    'KeyI',
    'KeyO',
    'KeyP',
    'BracketLeft',
    'BracketRight',
  ],
].flat();

export const shiftDownCode = 'KeyZ';
export const shiftUpCode = 'KeyX';
export const sustainCode = 'Space';
/** How many consecutive keys the two rows play. */
export const playingKeyCount = playingRows.length;

/** How many keys above the lowest playing key `code` plays, or null for a key that does not play. */
export function keyOffsetOfCode(code: string): number | null {
  const offset = playingRows.indexOf(code);
  return offset < 0 ? null : offset;
}
