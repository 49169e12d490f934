import { FLAG_KINDS, flagText } from './flag-text';

describe('flagText', () => {
  it('has a title, a meaning and advice for every flag kind', () => {
    for (const kind of FLAG_KINDS) {
      const text = flagText(kind);
      expect([kind, text.title.length > 0, text.meaning.length > 0, text.whatToDo.length > 0]).toEqual([
        kind,
        true,
        true,
        true,
      ]);
    }
  });

  it('never leaves an unknown kind blank', () => expect(flagText('not-a-flag' as never).title).toBeTruthy());
});
