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

  it('words the charge-temperature flags that follow the chemistry profile', () => {
    // Cell datasheets (from memory): LiFePO4 charging stops about 45 °C, reduced current below about 10 °C
    expect(FLAG_KINDS).toEqual(expect.arrayContaining(['hot-charging', 'cold-charge-current']));
    expect(flagText('hot-charging').title).toBe('Charging a battery that is too hot');
    expect(flagText('cold-charge-current').meaning).toMatch(/10 °C/);
  });
});
