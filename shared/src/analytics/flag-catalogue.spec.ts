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

  it('names the limits of the charge-temperature flags that follow the chemistry profile', () => {
    // Cell datasheets (from memory): LiFePO4 charging stops about 45 °C, reduced current below about 10 °C
    expect(describeFlag('hot-charging').meaning).toMatch(/45 °C/);
    expect(describeFlag('cold-charge-current').meaning).toMatch(/10 °C/);
  });
});
