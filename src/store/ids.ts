/** Random identifier for new records (crypto where available, so ids do not collide across devices). */
export function newId(prefix: string): string {
  const c = (globalThis as { crypto?: Crypto }).crypto;
  if (c && typeof c.randomUUID === 'function') return `${prefix}-${c.randomUUID()}`;
  let s = '';
  for (let i = 0; i < 4; i++) s += Math.floor(Math.random() * 0x100000000).toString(16).padStart(8, '0');
  return `${prefix}-${s}`;
}

export function nowIso(): string {
  return new Date().toISOString();
}

/** Identity and times of a record being saved: kept from the record it replaces, new when there is none. */
export function stamp(prefix: string, existing: { id: string; createdAt: string } | undefined): { id: string; createdAt: string; updatedAt: string } {
  const now = nowIso();
  return { id: existing?.id ?? newId(prefix), createdAt: existing?.createdAt ?? now, updatedAt: now };
}
