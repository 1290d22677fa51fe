import { createHash } from 'node:crypto';
import { canonicalJson } from '@/shared/plans/canonical-json';
import type { ChainCheck } from '@/shared/schemas/incident';

/** What an entry's hash covers: everything in it but its own hash. */
export interface ChainedContent {
  seq: number;
  kind: string;
  actorId: string;
  recordedAt: Date;
  body: Record<string, unknown>;
  prevHash: string | null;
}

/**
 * sha256 (hex) of the entry's canonical JSON, which includes the previous
 * entry's hash: changing, removing or reordering any earlier entry changes
 * every hash after it (a hash chain, as in RFC 6962's append-only logs,
 * simplified to a list).
 */
export function entryHash(entry: ChainedContent): string {
  const content = canonicalJson({
    seq: entry.seq,
    kind: entry.kind,
    actorId: entry.actorId,
    recordedAt: entry.recordedAt.toISOString(),
    body: entry.body,
    prevHash: entry.prevHash,
  });
  return createHash('sha256').update(content, 'utf8').digest('hex');
}

/**
 * Walks the log in order and says whether every entry's hash matches its
 * content and its predecessor, and the head matches what the incident
 * recorded last. Numbers run 1, 2, 3 … without gaps.
 *
 * @param entries the log, ordered by `seq`
 * @param headHash the hash the incident row recorded for its last entry
 */
export function checkChain(entries: readonly (ChainedContent & { hash: string })[], headHash: string | null): ChainCheck {
  let prev: string | null = null;
  for (const [i, e] of entries.entries()) {
    if (e.seq !== i + 1 || e.prevHash !== prev || entryHash(e) !== e.hash) {
      return {
        intact: false,
        entries: entries.length,
        firstBrokenSeq: e.seq,
        headHash: entries.at(-1)?.hash ?? null,
        message: `The log has been altered: entry ${e.seq} does not match ${e.seq === i + 1 && e.prevHash === prev ? 'its content' : 'the entry before it'}.`,
      };
    }
    prev = e.hash;
  }
  if (prev !== headHash) {
    return {
      intact: false,
      entries: entries.length,
      firstBrokenSeq: entries.length > 0 ? entries.at(-1)!.seq : null,
      headHash: prev,
      message: 'The log has been altered: its last entry is not the one the incident recorded (entries were removed or added).',
    };
  }
  return {
    intact: true,
    entries: entries.length,
    firstBrokenSeq: null,
    headHash: prev,
    message: `All ${entries.length} entries check out: each carries the hash of the one before it.`,
  };
}

/** Drops `undefined` (which JSON and JSONB do not keep), so the hash covers exactly what is stored. */
export function storedForm<T>(body: T): T {
  return JSON.parse(JSON.stringify(body)) as T;
}
