import { ApiError } from "./api-client";

/**
 * Sends a multipart form to the API with upload progress (fetch cannot report it, XMLHttpRequest can).
 * Resolves with the JSON answer; rejects with the same ApiError the JSON client throws.
 */
export function uploadWithProgress<T>(path: string, form: FormData, onProgress?: (fraction: number) => void, signal?: AbortSignal, headers: Record<string, string> = {}): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", `/api${path}`);
    xhr.withCredentials = true;
    xhr.setRequestHeader("Accept", "application/json");
    for (const [name, value] of Object.entries(headers)) xhr.setRequestHeader(name, value);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress?.(e.loaded / e.total);
    };
    xhr.onload = () => {
      let body: unknown;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        body = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress?.(1);
        resolve(body as T);
        return;
      }
      // The error body's schema (and zod) loads only when an upload is refused.
      void import("@shared/api/error").then(({ apiErrorBodySchema }) => {
        const parsed = apiErrorBodySchema.safeParse(body);
        if (parsed.success) reject(new ApiError(xhr.status, parsed.data.error.code, parsed.data.error.message, parsed.data.error.fields));
        else if (xhr.status === 413) reject(new ApiError(413, "payload_too_large", "The file is larger than the upload limit; send a smaller file."));
        else reject(new ApiError(xhr.status, xhr.status >= 500 ? "internal" : "bad_request", `The upload failed (${xhr.status}).`));
      }, reject);
    };
    xhr.onerror = () => reject(new ApiError(0, "network", "Could not reach the server. Check the connection and try again."));
    xhr.onabort = () => reject(new DOMException("Upload cancelled", "AbortError"));
    signal?.addEventListener("abort", () => xhr.abort());
    xhr.send(form);
  });
}
