// Files the dashboard hands to or reads from the browser as Blobs (downloads, CSV previews, error bodies).

/** Hands a downloaded file to the browser's save dialog, then lets the object URL go. */
export function saveBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.click();
  // Revoked on the next turn: revoking at once can cancel the download in some browsers.
  setTimeout(() => URL.revokeObjectURL(url), 0);
}

// FileReader rather than Blob.text(): the same in every browser the dashboard supports and in jsdom.
/** The text of a Blob (UTF-8). */
export function blobText(blob: Blob): Promise<string> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(String(reader.result));
    reader.onerror = () => reject(reader.error);
    reader.readAsText(blob);
  });
}
