import { FLAG_KINDS as SHARED_FLAG_KINDS, describeFlag } from '@cellwarden/shared';
import type { FlagDescription, FlagKind } from '@cellwarden/shared';

/** What a flag is called, what it means and what to do about it. */
export type FlagText = FlagDescription;

/** The one place the dashboard reads flag wording from: shared/analytics' catalogue. */
export function flagText(kind: FlagKind): FlagText {
  return (
    describeFlag(kind) ?? {
      title: kind,
      meaning: 'A condition Cellwarden watches for is active.',
      whatToDo: 'Open the alerts list for details.',
    }
  );
}

/** Every flag kind, in the catalogue's order. */
export const FLAG_KINDS: readonly FlagKind[] = SHARED_FLAG_KINDS;
