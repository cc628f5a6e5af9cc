import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from './api-client';
import { postForm } from './post-form';

type Outcome = { status: number; body: string } | 'network-error';

/** Just enough of XMLHttpRequest to drive postForm: records the request, reports progress, then answers. */
function stubXhr(outcome: Outcome) {
  const sent: { method: string; url: string; headers: Record<string, string>; body: unknown; withCredentials: boolean }[] = [];
  class FakeXhr {
    status = 0;
    responseText = '';
    withCredentials = false;
    upload: { onprogress: ((e: { lengthComputable: boolean; loaded: number; total: number }) => void) | null } = { onprogress: null };
    onload: (() => void) | null = null;
    onerror: (() => void) | null = null;
    private request = { method: '', url: '', headers: {} as Record<string, string> };
    open(method: string, url: string) {
      this.request = { method, url, headers: {} };
    }
    setRequestHeader(name: string, value: string) {
      this.request.headers[name] = value;
    }
    send(body: unknown) {
      sent.push({ ...this.request, body, withCredentials: this.withCredentials });
      this.upload.onprogress?.({ lengthComputable: true, loaded: 50, total: 200 });
      this.upload.onprogress?.({ lengthComputable: true, loaded: 200, total: 200 });
      queueMicrotask(() => {
        if (outcome === 'network-error') return this.onerror?.();
        this.status = outcome.status;
        this.responseText = outcome.body;
        this.onload?.();
      });
    }
  }
  vi.stubGlobal('XMLHttpRequest', FakeXhr);
  return sent;
}

afterEach(() => vi.unstubAllGlobals());

describe('postForm', () => {
  it('posts the form with cookies, reports progress and resolves with the JSON body', async () => {
    const sent = stubXhr({ status: 201, body: JSON.stringify({ track: { id: 't1' } }) });
    const form = new FormData();
    form.append('title', 'Fills');
    const progress: number[] = [];
    const result = await postForm<{ track: { id: string } }>('/api/reel-tracks', form, { onProgress: (f) => progress.push(f) });
    expect(result.track.id).toBe('t1');
    expect(progress).toEqual([0.25, 1]);
    expect(sent).toEqual([{ method: 'POST', url: '/api/reel-tracks', headers: { Accept: 'application/json' }, body: form, withCredentials: true }]);
  });

  it('turns the server’s error body into an ApiError with its code, message and fields', async () => {
    stubXhr({ status: 422, body: JSON.stringify({ error: { code: 'unsupported_audio', message: 'That file is not a WAV or MP3.', fields: { file: 'Not audio' } } }) });
    const error = await postForm('/api/x', new FormData()).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 422, code: 'unsupported_audio', message: 'That file is not a WAV or MP3.', fields: { file: 'Not audio' } });
  });

  it('says the status and to try again when the answer has no error body (a proxy page, say)', async () => {
    stubXhr({ status: 502, body: '<html>Bad gateway</html>' });
    const error = await postForm('/api/x', new FormData(), { failureMessage: 'The message could not be sent' }).catch((e: unknown) => e);
    expect(error).toMatchObject({ status: 502, code: 'http_502', message: 'The message could not be sent (502). Please try again.' });
  });

  it('says the connection dropped when the request never gets an answer', async () => {
    stubXhr('network-error');
    const error = await postForm('/api/x', new FormData(), { networkMessage: 'Check your connection.' }).catch((e: unknown) => e);
    expect(error).toMatchObject({ status: 0, code: 'network', message: 'Check your connection.' });
  });
});
