// Files the API sends (PDF packages, CSV/XLSX results, captured attachments): fetched with the
// session's token, refused in the API's error shape, and saved the way a browser saves a download.
import { parse } from 'content-disposition';
import { exportFile } from 'quasar';
import { apiErrorSchema } from '@shared/schema/errors.ts';
import { ApiError, getToken } from './http.ts';

export interface DownloadedFile {
  blob: Blob;
  /** The name the server gave in Content-Disposition, when it gave one. */
  filename: string | null;
}

export async function fetchFile(path: string): Promise<DownloadedFile> {
  const token = getToken();
  let res: Response;
  try {
    res = await fetch(`/api${path}`, { headers: token ? { Authorization: `Bearer ${token}` } : {} });
  } catch (e) {
    throw new ApiError(0, 'network', `Cannot reach the server (${(e as Error).message})`);
  }
  if (!res.ok) {
    // The API's error shape when it sent one; otherwise the status says enough.
    const body = apiErrorSchema.safeParse(await res.json().catch(() => undefined));
    if (body.success) throw new ApiError(res.status, body.data.error.code, body.data.error.message);
    throw new ApiError(res.status, res.status === 404 ? 'not_found' : 'internal', `Download failed (${res.status})`);
  }
  return { blob: await res.blob(), filename: dispositionFilename(res.headers.get('Content-Disposition') ?? '') };
}

/** The file name a Content-Disposition header gives (RFC 6266, with filename* decoded), or null. */
export function dispositionFilename(header: string): string | null {
  return header ? (parse(header).parameters.filename ?? null) : null;
}

/** Saves a downloaded file the way the browser saves downloads (Quasar's exportFile). */
export function saveBlob(blob: Blob, filename: string): void {
  const saved = exportFile(filename, blob);
  if (saved !== true) throw saved;
}

/** Fetches a file and saves it under the server's name, or the fallback name. */
export async function downloadFile(path: string, fallbackName: string): Promise<void> {
  const file = await fetchFile(path);
  saveBlob(file.blob, file.filename ?? fallbackName);
}
