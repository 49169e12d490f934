import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  LOCALE_ID,
  computed,
  inject,
  input,
  signal,
} from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import type { InstallRegister as Register, RegisterCircuit, RegisterComponent } from '@cellwarden/shared';
import { catchError, combineLatest, of, switchMap } from 'rxjs';
import { Api } from '../core/api';
import { apiProblem } from '../core/api-error';
import { LoadState, loadError, loadedOr, toLoadState } from '../core/load-state';
import { Preferences } from '../core/preferences';
import { SystemNav } from '../core/system-nav/system-nav';
import { formatTemperature } from '../core/temperature-unit';
import { CircuitEditor } from './circuit-editor/circuit-editor';
import { ComponentEditor } from './component-editor/component-editor';
import { InstallRegisterApi } from './install-register-api';
import { componentSummary, conductorLabel, fuseDistanceLabel } from './register-words';
import { MeasuredPanel } from './measured-panel/measured-panel';
import { RecordPicker } from './record-picker/record-picker';

/** Route systems/:id/install: the install register, its verdicts, design against measured, and the record. */
@Component({
  selector: 'cw-install-register',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    DecimalPipe,
    MatButtonModule,
    MatIconModule,
    MatProgressSpinnerModule,
    SystemNav,
    ComponentEditor,
    CircuitEditor,
    MeasuredPanel,
    RecordPicker,
  ],
  templateUrl: './install-register.html',
  styleUrl: './install-register.scss',
})
export class InstallRegister {
  private readonly api = inject(InstallRegisterApi);
  private readonly systemsApi = inject(Api);
  private readonly preferences = inject(Preferences);
  private readonly locale = inject(LOCALE_ID);

  /** The system id from the route. */
  readonly id = input.required<string>();

  protected readonly unit = this.preferences.temperatureUnit;
  protected readonly revision = signal(0);
  protected readonly load = toSignal(
    combineLatest([toObservable(this.id), toObservable(this.revision)]).pipe(
      switchMap(([id]) =>
        // The server's own message, whatever it is.
        toLoadState(this.api.register(id), (error) => apiProblem(error).message),
      ),
    ),
    { initialValue: { status: 'loading' } as LoadState<Register> },
  );
  private readonly system = toSignal(
    toObservable(this.id).pipe(
      switchMap((id) => this.systemsApi.system(id).pipe(catchError(() => of(null)))),
    ),
    { initialValue: null },
  );
  /** Whether the access rule lets this person change the register (the server decides in the end). */
  protected readonly canConfigure = computed(() => {
    const allowed = this.system()?.allowedActions;
    return allowed === undefined || allowed.includes('configure');
  });
  protected readonly systemName = computed(() => this.system()?.name ?? null);
  protected readonly register = computed(() => loadedOr(this.load(), null));
  protected readonly problem = computed(() => loadError(this.load()));
  protected readonly editingComponent = signal<RegisterComponent | null>(null);
  protected readonly editingCircuit = signal<RegisterCircuit | null>(null);
  protected readonly notice = signal<string | null>(null);

  protected componentName(id: string): string {
    return this.register()?.components.find((c) => c.id === id)?.name ?? '—';
  }

  protected summary(component: RegisterComponent): string {
    return componentSummary(component.ratings, this.locale);
  }

  protected conductor(circuit: RegisterCircuit): string {
    return conductorLabel(circuit, this.locale);
  }

  protected fuseDistance(circuit: RegisterCircuit): string {
    return fuseDistanceLabel(circuit, this.locale);
  }

  protected ambient(celsius: number): string {
    return formatTemperature(celsius, this.unit());
  }

  protected editComponent(component: RegisterComponent): void {
    this.editingComponent.set(component);
  }

  protected editCircuit(circuit: RegisterCircuit): void {
    this.editingCircuit.set(circuit);
  }

  protected componentSaved(component: RegisterComponent): void {
    this.editingComponent.set(null);
    this.notice.set(`${component.name} is in the register.`);
    this.reload();
  }

  protected circuitSaved(circuit: RegisterCircuit): void {
    this.editingCircuit.set(null);
    this.notice.set(
      `${circuit.name} saved: ${circuit.verdict.ok ? 'it passes the wire and fuse rules' : 'it fails a rule — see its row'}.`,
    );
    this.reload();
  }

  protected removeComponent(component: RegisterComponent): void {
    this.api.removeComponent(this.id(), component.id).subscribe({
      next: () => {
        this.notice.set(`${component.name} removed.`);
        this.reload();
      },
      error: (error: unknown) => this.notice.set(apiProblem(error).message),
    });
  }

  protected removeCircuit(circuit: RegisterCircuit): void {
    this.api.removeCircuit(this.id(), circuit.id).subscribe({
      next: () => {
        this.notice.set(`${circuit.name} removed.`);
        this.reload();
      },
      error: (error: unknown) => this.notice.set(apiProblem(error).message),
    });
  }

  private reload(): void {
    this.revision.update((n) => n + 1);
  }
}
