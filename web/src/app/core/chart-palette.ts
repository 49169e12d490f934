import { DOCUMENT, Injectable, computed, inject } from '@angular/core';
import { Theme } from './theme';

/** The colours charts draw with, resolved from the theme's tokens for the mode in use. */
export interface ChartPalette {
  voltage: string;
  current: string;
  soc: string;
  temperature: string;
  /** Translucent bands behind a chart: a warning's span, a critical one's, a drag selection. */
  warningBand: string;
  criticalBand: string;
  selectionBand: string;
}

// The tokens live in styles.scss beside the status colours, so a chart line and the flag it explains match.
const TOKENS: Record<keyof ChartPalette, { token: string; alpha: number }> = {
  voltage: { token: '--cw-series-voltage', alpha: 1 },
  current: { token: '--cw-series-current', alpha: 1 },
  soc: { token: '--cw-series-soc', alpha: 1 },
  temperature: { token: '--cw-series-temperature', alpha: 1 },
  warningBand: { token: '--cw-status-caution', alpha: 0.2 },
  criticalBand: { token: '--cw-status-fault', alpha: 0.22 },
  selectionBand: { token: '--mat-sys-primary', alpha: 0.2 },
};

/** Used where no stylesheet answers (unit tests, a print without styles): the light theme's values. */
export const FALLBACK_PALETTE: ChartPalette = {
  voltage: 'rgb(89, 86, 160)',
  current: 'rgb(170, 92, 50)',
  soc: 'rgb(58, 106, 74)',
  temperature: 'rgb(138, 92, 0)',
  warningBand: 'rgba(138, 92, 0, 0.2)',
  criticalBand: 'rgba(186, 26, 26, 0.22)',
  selectionBand: 'rgba(89, 86, 160, 0.2)',
};

/**
 * Chart colours that follow the light and dark themes. A canvas cannot read CSS variables, and a custom property
 * holding `light-dark()` reads back as its source text, so each token is resolved through a probe element's
 * computed `color`, which the browser gives as rgb() for the current colour scheme.
 */
@Injectable({ providedIn: 'root' })
export class ChartColours {
  private readonly document = inject(DOCUMENT);
  private readonly theme = inject(Theme);

  /** The palette of the current mode; recomputed when the mode changes. */
  readonly palette = computed<ChartPalette>(() => {
    this.theme.mode();
    return resolvePalette(this.document);
  });
}

/** Reads every token through one probe element; any token the page does not define keeps its fallback. */
export function resolvePalette(document: Document): ChartPalette {
  const view = document.defaultView;
  if (!view || !document.body) return FALLBACK_PALETTE;
  const probe = document.createElement('span');
  probe.style.display = 'none';
  document.body.appendChild(probe);
  try {
    const palette = { ...FALLBACK_PALETTE };
    for (const [key, { token, alpha }] of Object.entries(TOKENS) as [
      keyof ChartPalette,
      (typeof TOKENS)[keyof ChartPalette],
    ][]) {
      probe.style.color = '';
      probe.style.color = `var(${token})`;
      const rgb = parseRgb(view.getComputedStyle(probe).color);
      if (rgb) palette[key] = alpha === 1 ? `rgb(${rgb.join(', ')})` : `rgba(${rgb.join(', ')}, ${alpha})`;
    }
    return palette;
  } finally {
    probe.remove();
  }
}

/** The red, green and blue of a computed `rgb()`/`rgba()` colour; null for anything else. */
export function parseRgb(color: string): [number, number, number] | null {
  const match = /^rgba?\(\s*(\d+(?:\.\d+)?)[\s,]+(\d+(?:\.\d+)?)[\s,]+(\d+(?:\.\d+)?)/.exec(color.trim());
  return match ? [Number(match[1]), Number(match[2]), Number(match[3])] : null;
}
