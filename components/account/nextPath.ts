/** Where to go after signing in: only a path inside this app, never another site ("//x", "https:"). */
export function safeNext(next: string | string[] | undefined, fallback = '/'): string {
  const n = Array.isArray(next) ? next[0] : next;
  if (!n || !n.startsWith('/') || n.startsWith('//') || n.includes('\\')) return fallback;
  return n;
}
