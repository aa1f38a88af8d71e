import type { Answer } from '../shared/api';

export interface ImportAnswer {
  imported: number;
  checked: number;
}

/**
 * POST /api/runs/import with `{ records }`. XMLHttpRequest rather than fetch, for its upload
 * progress: a few thousand rows over a weak signal take a while.
 */
export function sendRunRecords(
  records: Record<string, string>[],
  onProgress: (share: number) => void,
): Promise<Answer<ImportAnswer>> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/runs/import');
    xhr.setRequestHeader('Content-Type', 'application/json');
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.timeout = 120_000;
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.upload.onload = () => onProgress(1);
    xhr.onload = () => {
      let body: unknown;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300)
        return resolve({ ok: true, status: xhr.status, data: body as ImportAnswer });
      const error = (body as { error?: { message?: string; fields?: Record<string, string> } } | undefined)?.error;
      resolve({
        ok: false,
        problem: {
          status: xhr.status,
          message: error?.message ?? `The server answered ${xhr.status}; nothing was imported.`,
          fields: error?.fields ?? {},
        },
      });
    };
    const lost = () =>
      resolve({
        ok: false,
        problem: {
          status: 0,
          message:
            'No answer from the server, so Lashline cannot tell whether the runs were imported. Check the recent runs before sending the file again.',
          fields: {},
        },
      });
    xhr.onerror = lost;
    xhr.ontimeout = lost;
    xhr.send(JSON.stringify({ records }));
  });
}
