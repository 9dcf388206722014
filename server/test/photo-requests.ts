/** Multipart requests to `/api/photos` as the phone sends them. */
export interface PhotoFields {
  id?: string;
  ownerType?: string;
  ownerId?: string;
  takenAt?: string;
}

export function photoForm(fields: PhotoFields, file?: { bytes: Buffer; name?: string; type?: string }): FormData {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) if (value !== undefined) form.append(name, value);
  if (file) form.append('file', new Blob([new Uint8Array(file.bytes)], { type: file.type ?? 'image/jpeg' }), file.name ?? 'photo.jpg');
  return form;
}

export function postPhoto(baseUrl: string, token: string, form: FormData): Promise<Response> {
  return fetch(`${baseUrl}/api/photos`, { method: 'POST', headers: { authorization: `Bearer ${token}` }, body: form });
}

export function getWithToken(baseUrl: string, token: string, path: string, headers: Record<string, string> = {}): Promise<Response> {
  return fetch(`${baseUrl}${path}`, { headers: { authorization: `Bearer ${token}`, ...headers } });
}

export async function bytesOf(res: Response): Promise<Buffer> {
  return Buffer.from(await res.arrayBuffer());
}
