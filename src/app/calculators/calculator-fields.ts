import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';

import { CalculatorForm } from './calculator-form';
import { OptionField } from './option-field';
import { QuantityField } from './quantity-field';

/** Every input of a calculator in its own order; a one-of group shows a choice, then the member picked. */
@Component({
  selector: 'fl-calculator-fields',
  imports: [MatButtonToggle, MatButtonToggleGroup, OptionField, QuantityField, ReactiveFormsModule],
  template: `
    @for (item of form().items; track $index) {
      @switch (item.kind) {
        @case ('quantity') {
          <fl-quantity-field
            [input]="item.input"
            [controls]="item.controls"
            [optional]="item.input.optional"
            [error]="errors().get(item.input.name)"
          />
        }
        @case ('option') {
          <fl-option-field [input]="item.input" [control]="item.control" [error]="errors().get(item.input.name)" />
        }
        @case ('group') {
          <div class="group">
            <span class="group-label" [id]="form().uid + '-' + item.group.id">{{ item.group.label }}</span>
            <mat-button-toggle-group
              [formControl]="item.control"
              [attr.aria-labelledby]="form().uid + '-' + item.group.id"
            >
              @for (member of item.members; track member.input.name) {
                <mat-button-toggle [value]="member.input.name">{{ member.input.label }}</mat-button-toggle>
              }
            </mat-button-toggle-group>
            @for (member of item.members; track member.input.name) {
              @if (form().picks()[item.group.id] === member.input.name) {
                <fl-quantity-field
                  [input]="member.input"
                  [controls]="member.controls"
                  [optional]="!item.group.required"
                  [error]="errors().get(member.input.name)"
                />
              }
            }
          </div>
        }
      }
    }
  `,
  styles: `
    :host {
      display: flex;
      flex-direction: column;
      gap: 1rem;
    }

    .group {
      display: flex;
      flex-direction: column;
      gap: 0.75rem;
      padding: 0.75rem 0.75rem 0.25rem;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: var(--mat-sys-corner-medium);
    }

    .group-label {
      font: var(--mat-sys-title-small);
    }

    mat-button-toggle-group {
      align-self: flex-start;
      flex-wrap: wrap;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalculatorFields {
  readonly form = input.required<CalculatorForm>();
  /** Input name → the engine's message for it. */
  readonly errors = input.required<ReadonlyMap<string, string>>();
}
