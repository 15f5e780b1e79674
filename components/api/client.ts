// The one place the app talks HTTP. Screens use the hooks built on this, never fetch directly.
import { CSRF_HEADER } from '../../shared/schemas/auth';

export class ApiError extends Error {
  constructor(
    public status: number,
    public code: string,
    message: string,
    public fields?: Record<string, string>,
  ) {
    super(message);
  }
}

const base = process.env.EXPO_PUBLIC_API_URL ?? '';

export type ApiInit = RequestInit & { json?: unknown; acceptStatus?: number[] };

export async function api<T>(path: string, init: ApiInit = {}): Promise<T> {
  const { json, headers, acceptStatus, ...rest } = init;
  const res = await reach(`${base}/api${path}`, {
    credentials: 'include',
    ...rest,
    headers: {
      Accept: 'application/json',
      // The API refuses cookie-signed changes without it; a cross-site form cannot send it.
      [CSRF_HEADER]: '1',
      ...(json !== undefined ? { 'Content-Type': 'application/json' } : {}),
      ...(headers as Record<string, string> | undefined),
    },
    body: json !== undefined ? JSON.stringify(json) : (rest.body as BodyInit | undefined),
  });
  const text = await res.text();
  const data = text ? safeJson(text) : null;
  if (!res.ok && !acceptStatus?.includes(res.status)) {
    const err = (data as { error?: { code?: string; message?: string; fields?: Record<string, string> } } | null)?.error;
    throw new ApiError(res.status, err?.code ?? 'http_error', err?.message ?? `Request failed (${res.status})`, err?.fields);
  }
  return data as T;
}

/** What every screen says when a request got no answer at all (offline, server down). */
export const NO_ANSWER = 'No answer from the server: check the connection and try again';

/** fetch, with "no answer at all" turned into an ApiError a form can show. */
export async function reach(url: string, init: RequestInit): Promise<Response> {
  try {
    return await fetch(url, init);
  } catch (e) {
    // A cancelled request (a query no longer needed) stays what it is.
    if ((e as Error)?.name === 'AbortError') throw e;
    throw new ApiError(0, 'no_answer', NO_ANSWER);
  }
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return { error: { code: 'bad_response', message: 'The server sent a response that is not JSON' } };
  }
}
