import { describeFlag } from './flag-catalogue';
import { FLAG_KINDS } from './flag-event';

describe('describeFlag', () => {
  it('explains every flag kind in words', () => {
    for (const kind of FLAG_KINDS) {
      const description = describeFlag(kind);
      expect(description.title.length).toBeGreaterThan(5);
      expect(description.meaning.length).toBeGreaterThan(20);
      expect(description.whatToDo.length).toBeGreaterThan(20);
    }
  });

  it('tells a van dweller to stop charging or warm a freezing LiFePO4 pack, and that the BMS protects it', () => {
    const { meaning, whatToDo } = describeFlag('cold-charging');
    // LiFePO4 must not be charged below 0 °C (cell datasheets, common practice; from memory)
    expect(meaning).toMatch(/0 °C/);
    expect(whatToDo).toMatch(/stop charging/i);
    expect(whatToDo).toMatch(/warm/);
    expect(whatToDo).toMatch(/BMS/);
  });
});
