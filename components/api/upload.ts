// Multipart uploads with progress. fetch() cannot report upload progress, so this one path uses
// XMLHttpRequest; it sends what api() sends (the session cookie and the CSRF header) and turns
// error answers into the same ApiError.
import { CSRF_HEADER } from '../../shared/schemas/auth';
import { ApiError, NO_ANSWER } from './client';

const base = process.env.EXPO_PUBLIC_API_URL ?? '';

/** The full address of an API path, for <Image> sources and download links. */
export function apiUrl(path: string): string {
  return `${base}/api${path}`;
}

export interface UploadProgress {
  loaded: number;
  total: number;
  /** 0–1; null while the browser does not know the total yet. */
  fraction: number | null;
}

export interface UploadOptions {
  onProgress?: (p: UploadProgress) => void;
  signal?: AbortSignal;
  /** The form field the file goes in; "file" unless the route names another (archives: "archive"). */
  fieldName?: string;
}

/** Field values sent beside the file; undefined values are left out. */
export type UploadFields = Record<string, string | undefined>;

export function uploadFile<T>(path: string, file: Blob & { name?: string }, fields: UploadFields = {}, opts: UploadOptions = {}): Promise<T> {
  const form = new FormData();
  // Text fields first: the server reads them before the file part arrives.
  for (const [k, v] of Object.entries(fields)) if (v !== undefined) form.append(k, v);
  form.append(opts.fieldName ?? 'file', file, file.name ?? 'upload');

  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', apiUrl(path));
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.setRequestHeader(CSRF_HEADER, '1');
    xhr.upload.onprogress = (e) => {
      opts.onProgress?.({ loaded: e.loaded, total: e.total, fraction: e.lengthComputable && e.total > 0 ? e.loaded / e.total : null });
    };
    xhr.onload = () => {
      const data = parse(xhr.responseText);
      if (xhr.status >= 200 && xhr.status < 300) {
        resolve(data as T);
        return;
      }
      const err = (data as { error?: { code?: string; message?: string; fields?: Record<string, string> } } | null)?.error;
      const fallback = xhr.status === 413 ? 'The file is larger than the server accepts' : `Upload failed (${xhr.status})`;
      reject(new ApiError(xhr.status, err?.code ?? (xhr.status === 413 ? 'file_too_large' : 'http_error'), err?.message ?? fallback, err?.fields));
    };
    xhr.onerror = () => reject(new ApiError(0, 'no_answer', NO_ANSWER));
    xhr.onabort = () => reject(new ApiError(0, 'aborted', 'The upload was cancelled'));
    if (opts.signal) {
      if (opts.signal.aborted) {
        reject(new ApiError(0, 'aborted', 'The upload was cancelled'));
        return;
      }
      opts.signal.addEventListener('abort', () => xhr.abort(), { once: true });
    }
    xhr.send(form);
  });
}

function parse(text: string): unknown {
  if (!text) return null;
  try {
    return JSON.parse(text);
  } catch {
    return { error: { code: 'bad_response', message: 'The server sent a response that is not JSON' } };
  }
}
