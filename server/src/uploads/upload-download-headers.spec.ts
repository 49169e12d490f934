import { uploadDownloadHeaders } from './upload-download-headers';

describe('uploadDownloadHeaders', () => {
  it('serves a log as UTF-8 text in an attachment, never sniffed', () => {
    const headers = uploadDownloadHeaders({ contentType: 'text/csv', fileName: 'log.csv' });
    expect(headers['Content-Type']).toBe('text/csv; charset=utf-8');
    expect(headers['Content-Disposition']).toBe(`attachment; filename="log.csv"; filename*=UTF-8''log.csv`);
    // WHATWG Fetch §X-Content-Type-Options: "nosniff" is the only value.
    expect(headers['X-Content-Type-Options']).toBe('nosniff');
  });

  it('shows a photo inline', () => {
    const headers = uploadDownloadHeaders({ contentType: 'image/png', fileName: 'fuse.png' });
    expect(headers['Content-Type']).toBe('image/png');
    expect(headers['Content-Disposition'].startsWith('inline;')).toBe(true);
  });

  it('encodes a non-ASCII name per RFC 8187 and keeps quotes out of the fallback', () => {
    const headers = uploadDownloadHeaders({ contentType: 'image/jpeg', fileName: 'Bjørn "van".jpg' });
    // RFC 8187 §3.2.3: percent-encoded UTF-8 octets; ø is U+00F8, UTF-8 C3 B8 (RFC 3629 §3).
    expect(headers['Content-Disposition']).toBe(
      `inline; filename="Bj_rn _van_.jpg"; filename*=UTF-8''Bj%C3%B8rn%20%22van%22.jpg`,
    );
  });
});
