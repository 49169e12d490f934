import { FALLBACK_PALETTE, parseRgb, resolvePalette } from './chart-palette';

/** A document whose computed colours come from a table of tokens, as a browser's would for one theme. */
function documentWith(colours: Record<string, string>): Document {
  const probe = { style: { color: '' }, remove: () => undefined };
  return {
    createElement: () => probe,
    body: { appendChild: () => probe },
    defaultView: {
      getComputedStyle: () => ({ color: colours[probe.style.color.replace(/^var\((.*)\)$/, '$1')] ?? '' }),
    },
  } as unknown as Document;
}

describe('chart palette', () => {
  it('reads each line colour from its theme token and makes the bands translucent', () => {
    const palette = resolvePalette(
      documentWith({
        '--cw-series-voltage': 'rgb(196, 192, 255)',
        '--cw-series-current': 'rgb(255, 182, 140)',
        '--cw-status-caution': 'rgb(255, 186, 62)',
        '--mat-sys-primary': 'rgb(196, 192, 255)',
      }),
    );
    expect(palette.voltage).toBe('rgb(196, 192, 255)');
    expect(palette.current).toBe('rgb(255, 182, 140)');
    expect(palette.warningBand).toBe('rgba(255, 186, 62, 0.2)');
    expect(palette.selectionBand).toBe('rgba(196, 192, 255, 0.2)');
    // A token the page does not define keeps the fallback rather than an empty colour.
    expect(palette.soc).toBe(FALLBACK_PALETTE.soc);
  });

  it('falls back entirely without a rendered page', () =>
    expect(resolvePalette({ defaultView: null, body: null } as unknown as Document)).toEqual(
      FALLBACK_PALETTE,
    ));

  it('parses computed rgb and rgba colours and nothing else', () => {
    expect(parseRgb('rgb(12, 34, 56)')).toEqual([12, 34, 56]);
    expect(parseRgb('rgba(12, 34, 56, 0.5)')).toEqual([12, 34, 56]);
    expect(parseRgb('rgb(12 34 56)')).toEqual([12, 34, 56]);
    expect(parseRgb('light-dark(#fff, #000)')).toBeNull();
  });
});
