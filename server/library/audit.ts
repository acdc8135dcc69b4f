import type { AuditAction } from '../../shared/api/audit';
import type { Database } from '../db/client';
import { auditLog } from '../db/schema';

type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0];
export type Writer = Database | Transaction;

export interface AuditEntry {
  actorId: string;
  action: AuditAction;
  bandId?: string | null;
  presetId?: string | null;
  detail?: Record<string, unknown>;
}

/** Appends to the audit log, inside the caller's transaction so that the entry and the change land together. */
export async function recordAudit(writer: Writer, entry: AuditEntry): Promise<void> {
  await writer.insert(auditLog).values({
    actorId: entry.actorId,
    action: entry.action,
    bandId: entry.bandId ?? null,
    presetId: entry.presetId ?? null,
    detail: entry.detail ?? null,
  });
}
