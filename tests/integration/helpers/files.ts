// Files through the app with a signed-in client's session: a multipart upload (the JSON client
// cannot send files) and a download of the raw bytes.
import { APP_URL, type Client } from './http';

const cookieOf = (client: Client) =>
  [...((client as unknown as { cookies: Map<string, string> }).cookies ?? new Map())]
    .map(([k, v]) => `${k}=${v}`)
    .join('; ');

export async function upload(
  client: Client,
  path: string,
  file: { name: string; data: Uint8Array | string },
  fields: Record<string, string>,
) {
  const form = new FormData();
  form.set('file', new Blob([file.data as BlobPart]), file.name);
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  const res = await fetch(APP_URL + path, {
    method: 'POST',
    body: form,
    headers: { cookie: cookieOf(client) },
  });
  const text = await res.text();
  let json: any = null;
  try {
    json = JSON.parse(text);
  } catch {
    json = null;
  }
  return { status: res.status, json, text };
}

export async function download(client: Client, path: string) {
  const res = await fetch(APP_URL + path, { headers: { cookie: cookieOf(client) } });
  return { status: res.status, bytes: new Uint8Array(await res.arrayBuffer()), headers: res.headers };
}
