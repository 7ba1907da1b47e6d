'use client';

import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { QueuedWrite } from '@/lib/bench/queue';
import type { BenchRecord } from '@/lib/types/bench';

/** The last known state of a session's records on this phone, for opening the bench view offline. */
export type BenchSnapshot = { key: string; savedAt: string; records: BenchRecord[]; minutesSpent: number };

interface BenchDb extends DBSchema {
  writes: { key: string; value: QueuedWrite; indexes: { byMember: number } };
  snapshots: { key: string; value: BenchSnapshot };
}

let opened: Promise<IDBPDatabase<BenchDb>> | null = null;

/** The phone's own store of queued writes (kept per member) and session snapshots, through idb. */
function db(): Promise<IDBPDatabase<BenchDb>> {
  opened ??= openDB<BenchDb>('scribeline-bench', 1, {
    upgrade(d) {
      const writes = d.createObjectStore('writes', { keyPath: 'clientId' });
      writes.createIndex('byMember', 'memberId');
      d.createObjectStore('snapshots', { keyPath: 'key' });
    },
  });
  return opened;
}

export const snapshotKey = (memberId: number, sessionId: number) => `${memberId}:${sessionId}`;

export async function memberWrites(memberId: number): Promise<QueuedWrite[]> {
  return (await db()).getAllFromIndex('writes', 'byMember', memberId);
}

export async function putWrite(w: QueuedWrite): Promise<void> {
  await (await db()).put('writes', w);
}

export async function removeWrite(clientId: string): Promise<void> {
  await (await db()).delete('writes', clientId);
}

export async function readSnapshot(key: string): Promise<BenchSnapshot | undefined> {
  return (await db()).get('snapshots', key);
}

export async function saveSnapshot(s: BenchSnapshot): Promise<void> {
  await (await db()).put('snapshots', s);
}
