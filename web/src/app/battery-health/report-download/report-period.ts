// The report's period from two calendar days typed by the viewer: their local midnights, the last day included.

const MAX_DAYS = 800;

/** A day as an <input type="date"> value in the viewer's zone: "2026-03-14". */
export function dayInputValue(at: number): string {
  const d = new Date(at);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}

/** Local midnight of an input day, or null when the text is not a day. */
function localMidnight(day: string): Date | null {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(day);
  if (!match) return null;
  const date = new Date(Number(match[1]), Number(match[2]) - 1, Number(match[3]));
  return Number.isNaN(date.getTime()) ? null : date;
}

/** [from, to) for the days chosen, or the problem that stops a download, naming the field. */
export function reportPeriod(
  firstDay: string,
  lastDay: string,
): { from?: Date; to?: Date; problem?: string } {
  const from = localMidnight(firstDay);
  if (!from) return { problem: 'First day: choose a day.' };
  const last = localMidnight(lastDay);
  if (!last) return { problem: 'Last day: choose a day.' };
  const to = new Date(last.getFullYear(), last.getMonth(), last.getDate() + 1);
  if (to <= from) return { problem: 'Last day: it must not be before the first day.' };
  if (to.getTime() - from.getTime() > MAX_DAYS * 86_400_000)
    return { problem: `Last day: a report covers at most ${MAX_DAYS} days.` };
  return { from, to };
}
