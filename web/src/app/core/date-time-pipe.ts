import { LOCALE_ID, Pipe, PipeTransform, inject } from '@angular/core';
import { DateTimeStyle, formatInstant } from './date-time';

/** An instant in the dashboard's one format for the viewer's locale: `{{ at | dateTime }}`, `{{ at | dateTime: 'time' }}`. */
@Pipe({ name: 'dateTime' })
export class DateTimePipe implements PipeTransform {
  private readonly locale = inject(LOCALE_ID);

  transform(ms: number | null | undefined, style: DateTimeStyle = 'dateTime', timeZone?: string): string {
    return formatInstant(ms, style, this.locale, timeZone);
  }
}
