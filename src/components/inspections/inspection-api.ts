import type { Answer, Problem } from '../shared/api';
import type { InspectionEntryView } from '../../lib/inspections/sheet-values';
import type { GearSetInfo, ProfileInfo } from './sheet-context';
import type { PhotoView } from '../../lib/inspections/views';

/**
 * The inspection endpoints as the sheet calls them. Like shared/api's callApi (never throws, a lost
 * answer is status 0), plus the Idempotency-Key header, and photo uploads through XMLHttpRequest
 * because fetch cannot report upload progress.
 */
export type InspectionViewLite = InspectionEntryView & {
  id: string;
  status: 'draft' | 'submitted';
  createdBy: string;
  revision: number;
};

// One shape for a photo, the server's (src/lib/inspections/views.ts).
export type { PhotoView };

const TIMEOUT_MS = 20_000;

function toProblem(status: number, body: unknown): Problem {
  const error = (body as { error?: { message?: unknown; fields?: unknown } } | null)?.error;
  return {
    status,
    message: typeof error?.message === 'string' ? error.message : `The server answered ${status}.`,
    fields: error?.fields && typeof error.fields === 'object' ? (error.fields as Record<string, string>) : {},
  };
}

const LOST: Problem = { status: 0, message: 'No answer from Lashline (offline or no signal).', fields: {} };

async function request<T>(
  path: string,
  method: string,
  body?: unknown,
  headers: Record<string, string> = {},
): Promise<Answer<T>> {
  const controller = new AbortController();
  const timer = setTimeout(() => controller.abort(), TIMEOUT_MS);
  try {
    const response = await fetch(path, {
      method,
      credentials: 'same-origin',
      headers: {
        Accept: 'application/json',
        ...(body === undefined ? {} : { 'Content-Type': 'application/json' }),
        ...headers,
      },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal: controller.signal,
    });
    const text = await response.text();
    let parsed: unknown;
    try {
      parsed = text ? JSON.parse(text) : undefined;
    } catch {
      parsed = undefined;
    }
    return response.ok
      ? { ok: true, status: response.status, data: parsed as T }
      : { ok: false, problem: toProblem(response.status, parsed) };
  } catch {
    return { ok: false, problem: LOST };
  } finally {
    clearTimeout(timer);
  }
}

export const inspectionApi = {
  create: (body: unknown, key: string) =>
    request<InspectionViewLite>('/api/inspections', 'POST', body, { 'Idempotency-Key': key }),
  patch: (id: string, body: unknown) =>
    request<InspectionViewLite>(`/api/inspections/${encodeURIComponent(id)}`, 'PATCH', body),
  submit: (id: string, key: string) =>
    request<InspectionViewLite>(`/api/inspections/${encodeURIComponent(id)}/submit`, 'POST', undefined, {
      'Idempotency-Key': key,
    }),
  get: (id: string) => request<InspectionViewLite>(`/api/inspections/${encodeURIComponent(id)}`, 'GET'),
  gearSet: (id: string) => request<GearSetInfo>(`/api/gear-sets/${encodeURIComponent(id)}`, 'GET'),
  profile: (gearSetId: string) =>
    request<ProfileInfo>(`/api/tolerance-profiles/for-gear-set/${encodeURIComponent(gearSetId)}`, 'GET'),
  runCount: (gearSetId: string, at: string) =>
    request<{ totalRuns: number; runsSinceInstall: number }>(
      `/api/gear-sets/${encodeURIComponent(gearSetId)}/run-count?at=${encodeURIComponent(at)}`,
      'GET',
    ),
  photos: (id: string) => request<{ items: PhotoView[] }>(`/api/inspections/${encodeURIComponent(id)}/photos`, 'GET'),
  deletePhoto: (id: string, photoId: string) =>
    request<unknown>(`/api/inspections/${encodeURIComponent(id)}/photos/${encodeURIComponent(photoId)}`, 'DELETE'),
};

export type InspectionApi = typeof inspectionApi;

/** Uploads one photo, reporting progress 0–1; resolves with the answer, never rejects. */
export function uploadPhoto(
  inspectionId: string,
  file: File,
  side: 'drive' | 'coast',
  onProgress: (share: number) => void,
): { done: Promise<Answer<PhotoView>>; abort: () => void } {
  const xhr = new XMLHttpRequest();
  const done = new Promise<Answer<PhotoView>>((resolve) => {
    xhr.open('POST', `/api/inspections/${encodeURIComponent(inspectionId)}/photos`);
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      let body: unknown;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
      } catch {
        body = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve({ ok: true, status: xhr.status, data: body as PhotoView });
      else resolve({ ok: false, problem: toProblem(xhr.status, body) });
    };
    xhr.onerror = () =>
      resolve({ ok: false, problem: { ...LOST, message: 'The upload stopped: no connection to Lashline.' } });
    xhr.onabort = () => resolve({ ok: false, problem: { status: 0, message: 'Upload cancelled.', fields: {} } });
    xhr.ontimeout = () => resolve({ ok: false, problem: { ...LOST, message: 'The upload timed out.' } });
    xhr.timeout = 5 * 60_000;
    const form = new FormData();
    form.append('side', side);
    form.append('file', file);
    xhr.send(form);
  });
  return { done, abort: () => xhr.abort() };
}
