import { Clipboard } from '@angular/cdk/clipboard';
import {
  ChangeDetectionStrategy,
  Component,
  DOCUMENT,
  computed,
  effect,
  inject,
  input,
  linkedSignal,
  untracked,
} from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { ErrorStateMatcher } from '@angular/material/core';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatIcon } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { ActivatedRoute, Params, Router, RouterLink } from '@angular/router';
import { EMPTY, debounceTime, map, switchMap } from 'rxjs';

import { describeCalculator } from '../../../shared/airflow';
import { CalculationResults } from './calculation-results';
import { CalculatorFields } from './calculator-fields';
import { CalculatorForm } from './calculator-form';
import { calculate, convertToSystem, exampleState, isGiven } from './form-state';
import { KatexRender } from './katex-render';
import { decodeShareLink, encodeShareLink } from './share-link';
import { UnitSystem } from './unit-system';
import { UnitSystemService } from './unit-system.service';
import { unitSuffix } from './unit-labels';
import { WorkedSteps } from './worked-steps';

/** Long enough to skip the keystrokes of one number, short enough to feel live. */
const settleMs = 150;

/** A field shows its message as soon as the engine refuses it, touched or not (e.g. from a link). */
const engineErrorState: ErrorStateMatcher = { isErrorState: (control) => !!control?.invalid };

/** One calculator: its form, live results, worked steps, a share link and a print layout. */
@Component({
  selector: 'fl-calculator-page',
  imports: [
    CalculationResults,
    CalculatorFields,
    KatexRender,
    MatButton,
    MatButtonToggle,
    MatButtonToggleGroup,
    MatIcon,
    RouterLink,
    WorkedSteps,
  ],
  providers: [{ provide: ErrorStateMatcher, useValue: engineErrorState }],
  templateUrl: './calculator-page.html',
  styleUrl: './calculator-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalculatorPage {
  /** The calculator's id, from the route. */
  readonly id = input.required<string>();

  private readonly route = inject(ActivatedRoute);
  private readonly router = inject(Router);
  private readonly clipboard = inject(Clipboard);
  private readonly snackBar = inject(MatSnackBar);
  private readonly unitSystems = inject(UnitSystemService);
  private readonly document = inject(DOCUMENT);

  protected readonly summary = computed(() => describeCalculator(this.id()));
  protected readonly noErrors: ReadonlyMap<string, string> = new Map();

  /** The form, opened from the link in the address bar, or on the worked example. */
  private readonly opened = computed(() => {
    const summary = this.summary();
    if (summary === undefined) return undefined;
    return untracked(() => {
      const preference = this.unitSystems.preference();
      const link = decodeShareLink(summary, this.route.snapshot.queryParams, preference);
      const state = link?.state ?? exampleState(summary, preference);
      return { form: new CalculatorForm(summary, state), system: link?.system ?? preference };
    });
  });

  protected readonly form = computed(() => this.opened()?.form);
  protected readonly system = linkedSignal<UnitSystem>(() => this.opened()?.system ?? 'si');

  /** The form's state once typing pauses: what is evaluated, put in the address bar and printed. */
  private readonly settled = linkedSignal(() => {
    const form = this.form();
    return form === undefined ? undefined : { form, state: form.state() };
  });

  protected readonly evaluation = computed(() => {
    const settled = this.settled();
    return settled === undefined ? undefined : calculate(settled.form.summary, settled.state);
  });

  /** The inputs as given, for the printed page. */
  protected readonly printedInputs = computed(() => {
    const settled = this.settled();
    if (settled === undefined) return [];
    const { summary } = settled.form;
    const { state } = settled;
    return summary.inputs
      .filter((input) => isGiven(input, state.picks))
      .flatMap((input) => {
        if (input.kind === 'option') {
          const chosen = input.options?.find((option) => option.value === state.options[input.name]);
          return chosen ? [{ label: input.label, symbol: '', value: chosen.label, unit: '' }] : [];
        }
        const entry = state.quantities[input.name];
        const text = entry?.text.trim() ?? '';
        return entry && text ? [{ label: input.label, symbol: input.symbol, value: text, unit: unitSuffix(entry.unit) }] : [];
      });
  });

  constructor() {
    toObservable(this.form)
      .pipe(
        switchMap((form) =>
          form === undefined
            ? EMPTY
            : form.group.valueChanges.pipe(
                debounceTime(settleMs),
                map(() => ({ form, state: form.state() })),
              ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((settled) => this.settled.set(settled));

    // The engine's messages go onto the fields they name; the typed text is never touched.
    effect(() => {
      const settled = this.settled();
      const evaluation = this.evaluation();
      if (settled && evaluation) settled.form.showErrors(evaluation.fieldErrors);
    });

    // The address bar always holds a link to what is on screen.
    effect(() => {
      const settled = this.settled();
      if (settled === undefined) return;
      const params = encodeShareLink(settled.form.summary, settled.state, this.system());
      untracked(() => this.keepAddressShareable(params));
    });
  }

  protected changeSystem(system: UnitSystem): void {
    const form = this.form();
    if (form === undefined || system === this.system()) return;
    this.unitSystems.choose(system);
    this.system.set(system);
    form.replace(convertToSystem(form.summary, form.state(), system));
  }

  protected resetToExample(): void {
    const form = this.form();
    if (form === undefined) return;
    form.replace({ ...exampleState(form.summary, this.system()), outputUnits: form.state().outputUnits });
  }

  protected copyLink(): void {
    const form = this.form();
    if (form === undefined) return;
    const params = encodeShareLink(form.summary, form.state(), this.system());
    const tree = this.router.createUrlTree(['/calculators', form.summary.id], { queryParams: params });
    const url = new URL(this.router.serializeUrl(tree), this.document.baseURI).href;
    const copied = this.clipboard.copy(url);
    this.snackBar.open(copied ? 'Link copied' : 'Could not copy the link: the address bar holds the same one', undefined, {
      duration: 4000,
    });
  }

  protected print(): void {
    this.document.defaultView?.print();
  }

  private keepAddressShareable(params: Params): void {
    if (sameParams(this.route.snapshot.queryParams, params)) return;
    void this.router.navigate([], {
      relativeTo: this.route,
      queryParams: params,
      replaceUrl: true,
      // Typing must not scroll the page to the top.
      scroll: 'manual',
    });
  }
}

function sameParams(a: Params, b: Params): boolean {
  const keys = Object.keys(a);
  return keys.length === Object.keys(b).length && keys.every((key) => a[key] === b[key]);
}
