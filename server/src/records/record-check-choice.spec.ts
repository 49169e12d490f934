import { recordCheckChoices, type ChoosableCheck } from './record-check-choice';

const check = (id: string, sourceId: string, startedAt: number, over: Partial<ChoosableCheck> = {}) =>
  ({ id, sourceId, status: 'passed', startedAt, ratedCurrentA: 60, ...over }) as ChoosableCheck;

describe('which checks a commissioning record carries by default', () => {
  const ratings: Record<string, number> = { dcdc: 60, solar: 30 };
  const ratingOf = (id: string) => ratings[id];

  it('keeps the latest finished check of each source and leaves earlier ones out as superseded', () => {
    const choices = recordCheckChoices(
      [
        check('a', 'dcdc', 1, { status: 'failed' }),
        check('b', 'dcdc', 2),
        check('c', 'solar', 3, { ratedCurrentA: 30 }),
      ],
      ratingOf,
    );
    expect(choices.map((c) => [c.checkId, c.byDefault, c.leftOutBecause])).toEqual([
      ['c', true, null],
      ['b', true, null],
      ['a', false, 'superseded'],
    ]);
  });

  it('leaves out a check made against a rating the source no longer has, and checks without a verdict', () => {
    const choices = recordCheckChoices(
      [
        check('old', 'dcdc', 1, { ratedCurrentA: 40 }),
        check('run', 'dcdc', 2, { status: 'running' }),
        check('gone', 'wind', 3),
      ],
      ratingOf,
    );
    expect(Object.fromEntries(choices.map((c) => [c.checkId, c.leftOutBecause]))).toEqual({
      old: 'stale',
      run: 'unfinished',
      gone: 'stale',
    });
    expect(choices.every((c) => !c.byDefault)).toBe(true);
  });

  it('keeps a failed latest check: a failure belongs in the record', () => {
    const [choice] = recordCheckChoices([check('f', 'dcdc', 5, { status: 'failed' })], ratingOf);
    expect(choice).toMatchObject({ byDefault: true, leftOutBecause: null });
  });
});
