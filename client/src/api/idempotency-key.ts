// Idempotency-Key values for requests a client may send more than once (a lost answer, a
// retry after an outage): the server keeps the first and answers a repeat with it.
/** A random key that also works where crypto.randomUUID is missing (plain http on a LAN). */
export function newIdempotencyKey(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
}

/** One key per distinct body: the same body sent again goes under the same key, a changed one under a new key. */
export function keyPerBody(): (body: unknown) => string {
  let last: { body: string; key: string } | null = null;
  return (body) => {
    const text = JSON.stringify(body);
    if (last?.body !== text) last = { body: text, key: newIdempotencyKey() };
    return last.key;
  };
}
