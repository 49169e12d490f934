import type { ApiProblem } from '../core/api-error';

/** A refused import as people read it: "line 6, column voltage_v: voltage_v must be …" when the server names both. */
export function importProblemText(problem: ApiProblem): string {
  const line = /^line (\d+): (.*)$/s.exec(problem.message);
  if (line && problem.field && problem.field !== 'file' && problem.field !== 'row')
    return `line ${line[1]}, column ${problem.field}: ${line[2]}`;
  if (problem.status === 403)
    return `${problem.message}. Importing needs configure access to this system; ask its owner for it.`;
  return problem.message;
}
