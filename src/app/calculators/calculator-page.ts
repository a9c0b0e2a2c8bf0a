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
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatIcon } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { ActivatedRoute, Params, Router, RouterLink } from '@angular/router';

import { describeCalculator } from '../../../shared/airflow';
import { CalculatorForm } from './calculator-form';
import { CalculatorPanel } from './calculator-panel';
import { type FormState, convertToSystem, exampleState } from './form-state';
import { decodeShareLink, encodeShareLink } from './share-link';
import { UnitSystem } from './unit-system';
import { UnitSystemService } from './unit-system.service';

/**
 * One calculator: the panel (form, live results, worked steps) with the unit switch, a share
 * link kept in the address bar, reset and print.
 */
@Component({
  selector: 'fl-calculator-page',
  imports: [CalculatorPanel, MatButton, MatButtonToggle, MatButtonToggleGroup, MatIcon, RouterLink],
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

  /** The form's state once typing pauses, as the panel reports it: what goes in the address bar. */
  private readonly settled = linkedSignal<{ form: CalculatorForm; state: FormState } | undefined>(() => {
    const form = this.form();
    return form === undefined ? undefined : { form, state: untracked(() => form.state()) };
  });

  constructor() {
    // The address bar always holds a link to what is on screen.
    effect(() => {
      const settled = this.settled();
      if (settled === undefined) return;
      const params = encodeShareLink(settled.form.summary, settled.state, this.system());
      untracked(() => this.keepAddressShareable(params));
    });
  }

  protected formSettled(form: CalculatorForm, state: FormState): void {
    this.settled.set({ form, state });
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
