// The token an e-mailed link carries in its fragment (#token=...), which browsers never
// send to the server, so it stays out of request logs.
export function linkToken(hash: string): string {
  return new URLSearchParams(hash.replace(/^#/, '')).get('token') ?? '';
}

/** Where to go after signing in: only a path inside the app. */
export function safeRedirect(value: unknown): string {
  return typeof value === 'string' && value.startsWith('/') && !value.startsWith('//') ? value : '/';
}
