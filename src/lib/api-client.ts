import type { ApiErrorBody } from '@shared/schemas/errors';

/** An API answer that was not 2xx, with the server's code, message and field reasons. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

let csrfToken: string | null = null;

/** How the API is reached: the browser's fetch, or the server's own when it renders a page (see entry-server). */
let transport: typeof fetch = (input, init) => fetch(input, init);

export function setApiTransport(fetchApi: typeof fetch) {
  transport = fetchApi;
}

/** /api/me hands out the token; the account feature calls this whenever it reads /api/me. */
export function rememberCsrfToken(token: string | null) {
  csrfToken = token;
}

async function fetchCsrfToken(): Promise<string | null> {
  const res = await transport('/api/me', { credentials: 'same-origin', headers: { accept: 'application/json' } });
  const body = (await res.json()) as { csrfToken: string | null };
  csrfToken = body.csrfToken;
  return csrfToken;
}

const friendly: Record<number, string> = {
  401: 'Please sign in to do that.',
  403: 'Your account is not allowed to do that.',
  404: 'We could not find that.',
  413: 'That is too large to send.',
  429: 'Too many attempts in a short time. Wait a minute and try again.',
};

async function toApiError(res: Response): Promise<ApiError> {
  let body: Partial<ApiErrorBody> | null = null;
  try {
    body = (await res.json()) as ApiErrorBody;
  } catch {
    // not JSON: fall back to a message by status
  }
  const err = body?.error;
  return new ApiError(
    res.status,
    err?.code ?? 'http_' + res.status,
    err?.message ?? friendly[res.status] ?? 'Something went wrong. Try again in a moment.',
    err?.fields ?? {},
  );
}

type RequestOptions = { method?: string; body?: unknown; signal?: AbortSignal; headers?: Record<string, string> };

/** The request never reached the server (no connection, or the connection dropped). */
export const isOffline = (err: unknown) => err instanceof ApiError && err.code === 'offline';

/** fetch for the JSON API: sends the CSRF header on every change, throws ApiError on failure. */
export async function api<T>(url: string, { method = 'GET', body, signal, headers = {} }: RequestOptions = {}): Promise<T> {
  const unsafe = method !== 'GET' && method !== 'HEAD';
  const send = async (retry: boolean): Promise<T> => {
    const h: Record<string, string> = { accept: 'application/json', ...headers };
    const isForm = typeof FormData !== 'undefined' && body instanceof FormData;
    if (body !== undefined && !isForm) h['content-type'] = 'application/json';
    // a visitor has no session and no token; the server answers with a sign-in error instead
    const token = unsafe ? (csrfToken ?? (await fetchCsrfToken())) : null;
    if (token) h['x-csrf-token'] = token;
    const res = await transport(url, {
      method,
      headers: h,
      body: body === undefined ? undefined : isForm ? (body as FormData) : JSON.stringify(body),
      credentials: 'same-origin',
      // answers say how long a cache in front may keep them; the app itself always asks (a 304 when unchanged)
      cache: unsafe ? undefined : 'no-cache',
      signal,
    }).catch((err: unknown) => {
      if (signal?.aborted) throw err;
      throw new ApiError(
        0,
        'offline',
        'No connection. What this device kept still reads; try this again when you are back online.',
      );
    });
    if (res.ok) return (res.status === 204 ? undefined : await res.json()) as T;
    const error = await toApiError(res);
    if (unsafe && retry && error.code === 'csrf') {
      // the session changed (sign-in elsewhere, expiry): take a fresh token once
      await fetchCsrfToken();
      return send(false);
    }
    throw error;
  };
  return send(true);
}

/** Multipart upload with progress (fetch has no upload progress). */
export function uploadWithProgress<T>(url: string, form: FormData, onProgress: (fraction: number) => void): Promise<T> {
  return new Promise((resolve, reject) => {
    const run = async () => {
      const xhr = new XMLHttpRequest();
      xhr.open('POST', url);
      xhr.setRequestHeader('accept', 'application/json');
      const token = csrfToken ?? (await fetchCsrfToken());
      if (token) xhr.setRequestHeader('x-csrf-token', token);
      xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
      xhr.onerror = () => reject(new ApiError(0, 'network', 'The upload was interrupted. Check the connection and try again.'));
      xhr.onload = () => {
        const res = new Response(xhr.responseText, { status: xhr.status, headers: { 'content-type': 'application/json' } });
        if (xhr.status >= 200 && xhr.status < 300) resolve(JSON.parse(xhr.responseText) as T);
        else void toApiError(res).then(reject);
      };
      xhr.send(form);
    };
    void run().catch(reject);
  });
}
