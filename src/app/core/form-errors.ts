import { afterNextRender, type Injector, type WritableSignal } from '@angular/core';
import type { AbstractControl, FormGroup } from '@angular/forms';

import { problemOf } from './problem';

/**
 * Puts the server's field errors (`errors: [{ field, message }]`) on the matching controls as a
 * `server` error, shown beside the field like any other; returns the messages no control took.
 */
export function applyServerErrors(form: FormGroup, error: unknown): string[] {
  const unmatched: string[] = [];
  for (const { field, message } of problemOf(error)?.errors ?? []) {
    const control = form.get(field);
    if (control) {
      control.setErrors({ ...control.errors, server: message });
      control.markAsTouched();
    } else {
      unmatched.push(message);
    }
  }
  return unmatched;
}

/** The message to show beside a field: the first of its errors that has one, the server's last. */
export function fieldError(control: AbstractControl, messages: Readonly<Record<string, string>>): string | null {
  if (!control.errors || !(control.touched || control.dirty)) return null;
  for (const [key, message] of Object.entries(messages)) {
    if (control.hasError(key)) return message;
  }
  const server: unknown = control.getError('server');
  return typeof server === 'string' ? server : null;
}

/** After the next render, moves focus to the form's first field that is in error (WCAG 3.3.1). */
export function focusFirstInvalid(form: HTMLElement, injector: Injector): void {
  afterNextRender(() => form.querySelector<HTMLElement>('[formcontrolname].ng-invalid')?.focus(), { injector });
}

/** After the next render, moves focus to an element that announces an outcome (a heading, a message). */
export function focusAfterRender(target: () => HTMLElement | undefined, injector: Injector): void {
  afterNextRender(() => target()?.focus(), { injector });
}

export interface FormSubmission {
  readonly form: FormGroup;
  /** The `<form>` element, to move focus to the first field in error. */
  readonly element: HTMLElement | undefined;
  readonly injector: Injector;
  /** True while `send` runs (disables the submit button). */
  readonly busy: WritableSignal<boolean>;
  readonly send: () => Promise<void>;
  /** A refusal no field took (say, an expired link): the page says so its own way. */
  readonly onUnmatched?: (error: unknown, unmatched: string[]) => void;
}

/**
 * Every form's submit: an invalid form is not sent (its fields show their errors and the first
 * takes focus); otherwise `send` runs with `busy` set, and a refusal's field errors go beside
 * their fields, focus on the first of them.
 */
export async function submitForm({ form, element, injector, busy, send, onUnmatched }: FormSubmission): Promise<void> {
  if (form.invalid) {
    form.markAllAsTouched();
    if (element) focusFirstInvalid(element, injector);
    return;
  }
  busy.set(true);
  try {
    await send();
  } catch (error) {
    const unmatched = applyServerErrors(form, error);
    if (form.invalid) {
      if (element) focusFirstInvalid(element, injector);
    } else {
      onUnmatched?.(error, unmatched);
    }
  } finally {
    busy.set(false);
  }
}
