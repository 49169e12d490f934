import { NO_ERRORS_SCHEMA } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { BaseChartDirective } from 'ng2-charts';
import { ChartFigure } from './chart-figure';

describe('ChartFigure', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [ChartFigure] });
    // jsdom has no canvas: the chart.js directive stays out; what a screen reader meets is under test.
    TestBed.overrideComponent(ChartFigure, {
      remove: { imports: [BaseChartDirective] },
      add: { schemas: [NO_ERRORS_SCHEMA] },
    });
  });

  function render(inputs: Record<string, unknown>): HTMLElement {
    const fixture = TestBed.createComponent(ChartFigure);
    fixture.componentRef.setInput('type', 'bar');
    fixture.componentRef.setInput('data', { labels: ['in', 'out'], datasets: [{ data: [3, 2] }] });
    for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
    fixture.detectChanges();
    return fixture.nativeElement as HTMLElement;
  }

  it('names the canvas image by what it shows followed by the summary of its values', () => {
    const canvas = render({ name: 'Energy:', summary: 'in 3 kWh, out 2 kWh.' }).querySelector('canvas');
    expect(canvas?.getAttribute('role')).toBe('img');
    expect(canvas?.getAttribute('aria-label')).toBe('Energy: in 3 kWh, out 2 kWh.');
  });

  it('shows a caption only when one is given', () => {
    expect(render({ name: 'Energy:', summary: 's' }).querySelector('figcaption')).toBeNull();
    const captioned = render({ name: 'Energy:', summary: 's', caption: 'Energy in and out, kWh' });
    expect(captioned.querySelector('figure > figcaption')?.textContent?.trim()).toBe(
      'Energy in and out, kWh',
    );
  });

  it('writes the summary as hidden text only when the screen asks for it', () => {
    const quiet = render({ name: 'Chart of voltage.', summary: '12 readings.' });
    expect(quiet.querySelector('.cw-visually-hidden')).toBeNull();
    const spoken = render({ name: 'Chart of voltage.', summary: '12 readings.', summaryAsText: true });
    expect(spoken.querySelector('.cw-visually-hidden')?.textContent).toBe('12 readings.');
  });

  it('updates the name when the summary changes', () => {
    const fixture = TestBed.createComponent(ChartFigure);
    fixture.componentRef.setInput('type', 'line');
    fixture.componentRef.setInput('data', { datasets: [] });
    fixture.componentRef.setInput('name', 'Chart of voltage and current.');
    fixture.componentRef.setInput('summary', 'No readings in the last 3 hours.');
    fixture.detectChanges();
    fixture.componentRef.setInput('summary', '2 readings in the last 3 hours.');
    fixture.detectChanges();
    expect((fixture.nativeElement as HTMLElement).querySelector('canvas')?.getAttribute('aria-label')).toBe(
      'Chart of voltage and current. 2 readings in the last 3 hours.',
    );
  });
});
