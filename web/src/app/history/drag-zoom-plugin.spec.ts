import { selectionRange } from './drag-zoom-plugin';

// 0 ms at x = 100 px, 1000 ms at x = 600 px.
const axis = { left: 100, right: 600, valueFor: (px: number) => (px - 100) * 2 };

describe('selectionRange', () => {
  it('turns a drag into the time range under it', () =>
    expect(selectionRange(200, 350, axis)).toEqual({ from: 200, to: 500 }));
  it('accepts a drag from right to left', () =>
    expect(selectionRange(350, 200, axis)).toEqual({ from: 200, to: 500 }));
  it('clamps a drag that leaves the plot', () =>
    expect(selectionRange(50, 150, axis)).toEqual({ from: 0, to: 100 }));
  it('treats a tiny drag as a click', () => expect(selectionRange(300, 305, axis)).toBeNull());
});
