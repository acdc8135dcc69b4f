// Answers as the API types in shared/api/ declare them: times as the ISO strings JSON would make of them anyway.
import type { Timestamp } from '../../shared/api/wire';

export function iso(time: Date): Timestamp;
export function iso(time: Date | null): Timestamp | null;
export function iso(time: Date | null): Timestamp | null {
  return time ? time.toISOString() : null;
}
