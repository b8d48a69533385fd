// The error body's schema (and zod with it) loads with the first failed request, not with every screen's first download.
const errorBody = () => import("@shared/api/error").then((m) => m.apiErrorBodySchema);

/** A failed API call: HTTP status (0 when the server could not be reached), error code, message and per-field messages. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string>;
  /** The server's id for the request (in its log), for the user to quote when reporting a problem. */
  readonly requestId: string | null;
  /** With code `version_conflict`: the record as it is now, and who saved it when. */
  readonly conflict: { current: unknown; changedBy: string | null; changedAt: string | null } | null;

  constructor(
    status: number,
    code: string,
    message: string,
    fields: Record<string, string> = {},
    requestId: string | null = null,
    conflict: ApiError["conflict"] = null,
  ) {
    super(message);
    this.conflict = conflict;
    this.name = "ApiError";
    this.status = status;
    this.code = code;
    this.fields = fields;
    this.requestId = requestId;
  }

  get isClientError() {
    return this.status >= 400 && this.status < 500;
  }
  get isServerError() {
    return this.status >= 500 || this.status === 0;
  }
}

export const isApiError = (error: unknown): error is ApiError => error instanceof ApiError;

type QueryValue = string | number | boolean | null | undefined | readonly (string | number)[];
export type QueryParams = Record<string, QueryValue>;

type RequestOptions = { query?: QueryParams; body?: unknown; signal?: AbortSignal; headers?: Record<string, string> };

const BASE = "/api";

function buildUrl(path: string, query?: QueryParams): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query ?? {})) {
    if (value === undefined || value === null || value === "") continue;
    if (Array.isArray(value)) {
      if (value.length) params.set(key, value.join(","));
    } else {
      params.set(key, String(value));
    }
  }
  const qs = params.toString();
  return `${BASE}${path}${qs ? `?${qs}` : ""}`;
}

const FALLBACK_CODES: Record<number, string> = {
  400: "bad_request",
  401: "unauthenticated",
  403: "forbidden",
  404: "not_found",
  409: "conflict",
  413: "payload_too_large",
  429: "rate_limited",
};

async function toApiError(response: Response): Promise<ApiError> {
  let body: unknown = null;
  try {
    body = await response.json();
  } catch {
    // Not JSON (a proxy page, an empty body): fall through to a generic message.
  }
  const parsed = (await errorBody()).safeParse(body);
  const requestId = response.headers.get("X-Request-Id");
  if (parsed.success) {
    const { code, message, fields, current, changedBy, changedAt } = parsed.data.error;
    const conflict = code === "version_conflict" ? { current, changedBy: changedBy ?? null, changedAt: changedAt ?? null } : null;
    return new ApiError(response.status, code, message, fields, parsed.data.error.requestId ?? requestId, conflict);
  }
  const code = FALLBACK_CODES[response.status] ?? (response.status >= 500 ? "internal" : "bad_request");
  const message =
    response.status >= 500
      ? `The server could not answer (${response.status}). Try again in a moment.`
      : `The request failed (${response.status} ${response.statusText || "error"}).`;
  return new ApiError(response.status, code, message, {}, requestId);
}

async function request<T>(method: string, path: string, { query, body, signal, headers }: RequestOptions = {}): Promise<T> {
  let response: Response;
  try {
    response = await fetch(buildUrl(path, query), {
      method,
      credentials: "same-origin",
      headers: { Accept: "application/json", ...(body !== undefined ? { "Content-Type": "application/json" } : {}), ...headers },
      body: body !== undefined ? JSON.stringify(body) : undefined,
      signal,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === "AbortError") throw error;
    throw new ApiError(0, "network", "Could not reach the server. Check the connection and try again.");
  }
  if (!response.ok) throw await toApiError(response);
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

/** The one way the client talks to the API: JSON in and out, same-origin cookies, errors as ApiError. */
export const api = {
  get: <T>(path: string, options?: Omit<RequestOptions, "body">) => request<T>("GET", path, options),
  post: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, "body">) => request<T>("POST", path, { ...options, body }),
  patch: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, "body">) => request<T>("PATCH", path, { ...options, body }),
  put: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, "body">) => request<T>("PUT", path, { ...options, body }),
  delete: <T = void>(path: string, options?: Omit<RequestOptions, "body">) => request<T>("DELETE", path, options),
};

/** A same-origin URL under /api, for plain links (downloads). */
export const apiUrl = (path: string, query?: QueryParams) => buildUrl(path, query);
