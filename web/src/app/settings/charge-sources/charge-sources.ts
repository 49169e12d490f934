import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormArray, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { chargeSourceGroup } from '../settings-form';

/** Words for each charge source kind. */
export const SOURCE_KINDS = [
  { value: 'solar', label: 'Solar (controller output)' },
  { value: 'dc-dc', label: 'DC-DC charger' },
  { value: 'alternator', label: 'Alternator (direct)' },
  { value: 'shore', label: 'Shore / mains charger' },
  { value: 'other', label: 'Other' },
] as const;

/** The list of charge sources: add, remove, and edit kind, label, id and rated current. */
@Component({
  selector: 'cw-charge-sources',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
  ],
  templateUrl: './charge-sources.html',
  styleUrl: './charge-sources.scss',
})
export class ChargeSources {
  /** The form array of sources. */
  readonly sources = input.required<FormArray<ReturnType<typeof chargeSourceGroup>>>();
  /** No adding or removing: the person may not change this system's settings. */
  readonly readOnly = input(false);

  protected readonly kinds = SOURCE_KINDS;

  protected addSource(): void {
    this.sources().push(chargeSourceGroup());
    this.sources().markAsDirty();
  }

  protected removeSource(index: number): void {
    this.sources().removeAt(index);
    this.sources().markAsDirty();
  }
}
