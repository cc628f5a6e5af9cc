// The tus steps a stem upload takes, spoken by hand against a server in another process, plus a PATCH that
// trickles its bytes so a test can kill the server while they are still arriving.
import { deliveryPaths } from '@shared/schemas/deliveries';
import type { ApiClient } from './test-app';

const cookieOf = (client: ApiClient) => (client as unknown as { cookie: string }).cookie;
const b64 = (s: string) => Buffer.from(s).toString('base64');

export async function addFile(client: ApiClient, deliveryId: string, name: string, size: number): Promise<string> {
  const added = await client.post(deliveryPaths.files(deliveryId), { name, sizeBytes: size });
  if (added.status !== 201) throw new Error(`add file failed: ${added.status} ${JSON.stringify(added.body)}`);
  return added.body.file.id as string;
}

export async function tusCreate(base: string, client: ApiClient, fileId: string, size: number): Promise<string> {
  const res = await fetch(base + deliveryPaths.uploads, {
    method: 'POST',
    headers: { cookie: cookieOf(client), 'Tus-Resumable': '1.0.0', 'Upload-Length': String(size), 'Upload-Metadata': `fileId ${b64(fileId)}` },
  });
  if (res.status !== 201) throw new Error(`tus create failed: ${res.status} ${await res.text()}`);
  return res.headers.get('location')!;
}

export function tusPatch(base: string, client: ApiClient, location: string, offset: number, body: Buffer): Promise<Response> {
  return fetch(base + location, {
    method: 'PATCH',
    headers: { cookie: cookieOf(client), 'Tus-Resumable': '1.0.0', 'Upload-Offset': String(offset), 'Content-Type': 'application/offset+octet-stream' },
    body: new Uint8Array(body),
  });
}

/** The server's offset (HEAD), or the status when it has none to give. */
export async function tusOffset(base: string, client: ApiClient, location: string): Promise<{ status: number; offset: number | null }> {
  const res = await fetch(base + location, { method: 'HEAD', headers: { cookie: cookieOf(client), 'Tus-Resumable': '1.0.0' } });
  const raw = res.headers.get('upload-offset');
  return { status: res.status, offset: raw === null ? null : Number(raw) };
}

/**
 * Sends `bytes` from offset 0 in 64 KiB pieces with a pause between them and never ends on its own: the
 * request settles only when the server goes away (or the test aborts it). `sent()` tells how far it got.
 */
export function tusTrickle(base: string, client: ApiClient, location: string, bytes: Buffer, pauseMs = 20): { sent(): number; done: Promise<unknown>; abort(): void } {
  const controller = new AbortController();
  let sent = 0;
  const body = new ReadableStream<Uint8Array>({
    async pull(c) {
      await new Promise((r) => setTimeout(r, pauseMs));
      // Stop short of the end so the upload can only finish by resuming.
      const end = Math.min(bytes.length - 1, sent + 64 * 1024);
      if (sent >= end) return new Promise<void>(() => undefined);
      c.enqueue(new Uint8Array(bytes.subarray(sent, end)));
      sent = end;
    },
  });
  const done = fetch(base + location, {
    method: 'PATCH',
    headers: { cookie: cookieOf(client), 'Tus-Resumable': '1.0.0', 'Upload-Offset': '0', 'Content-Type': 'application/offset+octet-stream' },
    body,
    signal: controller.signal,
    duplex: 'half',
  } as RequestInit).catch((error: unknown) => error);
  return { sent: () => sent, done, abort: () => controller.abort() };
}
