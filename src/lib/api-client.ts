// The one place the client talks HTTP. Errors arrive as RFC 7807 problem
// documents and become ApiError with a readable message.
export interface ProblemField {
  path: string;
  message: string;
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly title: string,
    readonly detail: string,
    readonly fields: ProblemField[] = [],
  ) {
    super(detail || title);
  }
}

async function toError(res: Response): Promise<ApiError> {
  const text = await res.text();
  try {
    const p = JSON.parse(text) as { title?: string; detail?: string; errors?: ProblemField[] };
    return new ApiError(res.status, p.title ?? res.statusText, p.detail ?? '', p.errors ?? []);
  } catch {
    return new ApiError(res.status, res.statusText, text.slice(0, 200) || `Request failed (${res.status})`);
  }
}

type Body = Record<string, unknown> | unknown[] | FormData | undefined;

export async function api<T>(method: string, url: string, body?: Body, init: RequestInit = {}): Promise<T> {
  const headers = new Headers(init.headers);
  headers.set('X-Arcbench-Request', '1');
  let payload: BodyInit | undefined;
  if (body instanceof FormData) payload = body;
  else if (body !== undefined) {
    headers.set('Content-Type', 'application/json');
    payload = JSON.stringify(body);
  }
  const res = await fetch(url, { ...init, method, headers, body: payload, credentials: 'same-origin' });
  if (!res.ok) throw await toError(res);
  if (res.status === 204) return undefined as T;
  const type = res.headers.get('content-type') ?? '';
  return (type.includes('json') ? res.json() : res.text()) as Promise<T>;
}

export const apiGet = <T>(url: string, init?: RequestInit) => api<T>('GET', url, undefined, init);
export const apiPost = <T>(url: string, body?: Body) => api<T>('POST', url, body ?? {});
export const apiPatch = <T>(url: string, body: Body) => api<T>('PATCH', url, body);
export const apiPut = <T>(url: string, body: Body) => api<T>('PUT', url, body);
export const apiDelete = <T>(url: string) => api<T>('DELETE', url);
