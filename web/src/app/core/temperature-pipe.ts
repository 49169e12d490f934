import { Pipe, PipeTransform, inject } from '@angular/core';
import { Preferences } from './preferences';
import { formatTemperature } from './temperature-unit';

/** Shows a °C value in the person's chosen unit: `{{ r.temperature | temperature }}`. */
@Pipe({ name: 'temperature', pure: false })
export class TemperaturePipe implements PipeTransform {
  private readonly preferences = inject(Preferences);

  transform(celsius: number | null | undefined): string {
    return formatTemperature(celsius, this.preferences.temperatureUnit());
  }
}
