/** A file download answer: the right type, an attachment name, and never cached by a shared cache. */
export function download(body: string, filename: string, type: string): Response {
  return new Response(body, {
    status: 200,
    headers: {
      'Content-Type': `${type}; charset=utf-8`,
      'Content-Disposition': `attachment; filename="${filename.replace(/[^A-Za-z0-9._-]/g, '_')}"`,
      'Cache-Control': 'private, no-store',
    },
  });
}
