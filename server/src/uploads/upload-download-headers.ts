/** Response headers for serving a stored upload back, so a browser never runs or sniffs it as something else. */
export function uploadDownloadHeaders(upload: {
  contentType: string;
  fileName: string;
}): Record<string, string> {
  const isImage = upload.contentType === 'image/jpeg' || upload.contentType === 'image/png';
  // Logs are always served as text with an explicit charset and as an attachment (never rendered inline).
  const contentType = isImage ? upload.contentType : `${upload.contentType}; charset=utf-8`;
  return {
    'Content-Type': contentType,
    'Content-Disposition': contentDisposition(isImage ? 'inline' : 'attachment', upload.fileName),
    'X-Content-Type-Options': 'nosniff',
    'Content-Security-Policy': "default-src 'none'; sandbox",
    'Cache-Control': 'private, no-store',
  };
}

// RFC 6266 §4.3 with an ASCII fallback `filename` and the exact name in `filename*` (RFC 8187 §3.2.3).
function contentDisposition(type: 'inline' | 'attachment', fileName: string): string {
  const fallback = fileName.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  const encoded = encodeURIComponent(fileName).replace(
    /['()*]/g,
    (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`,
  );
  return `${type}; filename="${fallback}"; filename*=UTF-8''${encoded}`;
}
