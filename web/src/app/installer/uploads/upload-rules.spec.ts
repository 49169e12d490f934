import { MAX_UPLOAD_BYTES, formatBytes, uploadProblem } from './upload-rules';

describe('upload rules', () => {
  it('accepts a JPEG photo up to the 10 MB limit', () => {
    expect(uploadProblem({ name: 'fuse-box.jpg', type: 'image/jpeg', size: MAX_UPLOAD_BYTES })).toBeNull();
  });

  it('refuses a file one byte over 10 MB, naming the file and its size', () => {
    // 10 MB = 10 × 1,048,576 bytes (binary multiple, IEC 80000-13 "MiB"; common practice in file limits).
    const problem = uploadProblem({ name: 'wide.png', type: 'image/png', size: 10 * 1_048_576 + 1 });
    expect(problem).toContain('wide.png is 10.0 MB; the limit is 10 MB');
  });

  it('refuses a type outside photos and text logs', () => {
    expect(uploadProblem({ name: 'manual.pdf', type: 'application/pdf', size: 1000 })).toContain(
      'manual.pdf is application/pdf',
    );
  });

  it('formats sizes in B, KB and MB', () => {
    expect([formatBytes(512), formatBytes(2048), formatBytes(3 * 1_048_576)]).toEqual([
      '512 B',
      '2.0 KB',
      '3.0 MB',
    ]);
  });
});
