// Multipart POST with upload progress. fetch cannot report upload progress, so file uploads go through
// XMLHttpRequest here; a non-2xx answer becomes the same ApiError (server's code, message, fields) the api
// client throws, so forms show upload errors exactly like any other.
import { ApiError } from './api-client';

export type PostFormOptions = {
  onProgress?: (fraction: number) => void;
  /** Said when the connection drops mid-upload. */
  networkMessage?: string;
  /** Said when the server answers non-2xx without an error body of its own; the status is appended. */
  failureMessage?: string;
};

type ErrorBody = { error?: { code?: string; message?: string; fields?: Record<string, string> } };

function parseBody(text: string): unknown {
  if (!text) return null;
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

function errorFrom(status: number, body: unknown, failureMessage: string): ApiError {
  const error = (body as ErrorBody | null)?.error;
  return new ApiError({
    status,
    code: error?.code ?? `http_${status}`,
    message: error?.message ?? `${failureMessage} (${status}). Please try again.`,
    fields: error?.fields,
  });
}

/** Resolves with the parsed JSON body of a 2xx answer. */
export function postForm<T>(url: string, form: FormData, opts: PostFormOptions = {}): Promise<T> {
  const networkMessage = opts.networkMessage ?? 'The upload was interrupted. Check your connection and try again.';
  const failureMessage = opts.failureMessage ?? 'The upload failed';
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) opts.onProgress?.(e.loaded / e.total);
    };
    xhr.onerror = () => reject(new ApiError({ status: 0, code: 'network', message: networkMessage }));
    xhr.onload = () => {
      const body = parseBody(xhr.responseText);
      if (xhr.status >= 200 && xhr.status < 300) resolve(body as T);
      else reject(errorFrom(xhr.status, body, failureMessage));
    };
    xhr.send(form);
  });
}
