import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, ElementRef, Injector, inject, signal, viewChild } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';

import { applyServerErrors, fieldError, focusFirstInvalid } from '../core/form-errors';
import { CohortsApi } from './cohorts-api';

/** `/cohorts`: the instructor's cohorts, and a form to start a new one. */
@Component({
  selector: 'fl-cohort-list-page',
  imports: [DatePipe, MatButton, MatError, MatFormField, MatInput, MatLabel, ReactiveFormsModule, RouterLink],
  template: `
    <h1>Your cohorts</h1>
    @if (cohorts.hasValue()) {
      @if (cohorts.value().length) {
        <ul class="cohorts">
          @for (cohort of cohorts.value(); track cohort.id) {
            <li>
              <a [routerLink]="cohort.id" class="name">{{ cohort.name }}</a>
              <span class="meta">
                {{ cohort.memberCount }} {{ cohort.memberCount === 1 ? 'apprentice' : 'apprentices' }} · started
                <span class="figures">{{ cohort.createdAt | date: 'yyyy-MM-dd' }}</span>
              </span>
            </li>
          }
        </ul>
      } @else {
        <p>You have no cohorts yet. Start one below, then add apprentices to it by their e-mail address.</p>
      }
    } @else if (cohorts.error()) {
      <p role="alert">Your cohorts did not load. <button matButton type="button" (click)="cohorts.reload()">Try again</button></p>
    } @else {
      <p role="status">Loading your cohorts…</p>
    }

    <section aria-labelledby="new-cohort-heading">
      <h2 id="new-cohort-heading">Start a cohort</h2>
      <form #formElement [formGroup]="form" (ngSubmit)="create()" novalidate class="inline-form">
        <mat-form-field>
          <mat-label>Cohort name</mat-label>
          <input matInput formControlName="name" required />
          @if (errorOf(form.controls.name, nameMessages); as message) {
            <mat-error>{{ message }}</mat-error>
          }
        </mat-form-field>
        <button matButton="filled" type="submit" [disabled]="creating()">Create cohort</button>
      </form>
    </section>
  `,
  styleUrl: './cohorts.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CohortListPage {
  private readonly api = inject(CohortsApi);
  private readonly router = inject(Router);
  private readonly injector = inject(Injector);
  private readonly formElement = viewChild.required<ElementRef<HTMLFormElement>>('formElement');

  protected readonly cohorts = this.api.list();
  protected readonly form = inject(NonNullableFormBuilder).group({ name: ['', [Validators.required, Validators.minLength(2), Validators.maxLength(120)]] });
  protected readonly creating = signal(false);
  protected readonly errorOf = fieldError;
  protected readonly nameMessages = { required: 'Name the cohort.', minlength: 'Use at least 2 characters.', maxlength: 'Use at most 120 characters.' };

  protected async create(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      focusFirstInvalid(this.formElement().nativeElement, this.injector);
      return;
    }
    this.creating.set(true);
    try {
      const cohort = await this.api.create(this.form.getRawValue().name);
      await this.router.navigate(['/cohorts', cohort.id]);
    } catch (error) {
      applyServerErrors(this.form, error);
      focusFirstInvalid(this.formElement().nativeElement, this.injector);
    } finally {
      this.creating.set(false);
    }
  }
}
