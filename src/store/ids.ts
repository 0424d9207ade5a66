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
