import { HttpErrorResponse } from '@angular/common/http';
import { apiProblem, type ApiProblem } from '../core/api-error';

/**
 * The problem of a failed CSV call. A download asked for a Blob, so its `{ error }` body arrives as a Blob and
 * is read as JSON here before `apiProblem` looks at it.
 */
export async function transferProblem(error: unknown): Promise<ApiProblem> {
  if (error instanceof HttpErrorResponse && error.error instanceof Blob) {
    let body: unknown = null;
    try {
      body = JSON.parse(await blobText(error.error));
    } catch {
      // Not our JSON (a proxy's page): apiProblem falls back to the status.
    }
    return apiProblem(
      new HttpErrorResponse({
        error: body,
        status: error.status,
        statusText: error.statusText,
        url: error.url ?? undefined,
      }),
    );
  }
  return apiProblem(error);
}

/** A refused import as people read it: "line 6, column voltage_v: voltage_v must be …" when the server names both. */
export function importProblemText(problem: ApiProblem): string {
  const line = /^line (\d+): (.*)$/s.exec(problem.message);
  if (line && problem.field && problem.field !== 'file' && problem.field !== 'row')
    return `line ${line[1]}, column ${problem.field}: ${line[2]}`;
  if (problem.status === 403)
    return `${problem.message}. Importing needs configure access to this system; ask its owner for it.`;
  return problem.message;
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
