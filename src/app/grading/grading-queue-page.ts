import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, ElementRef, Injector, computed, inject, signal, viewChild } from '@angular/core';
import { FormArray, FormControl, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { RouterLink } from '@angular/router';

import type { GradingQueueItem } from '../../../shared/api/grading';
import { fieldError, focusAfterRender, submitForm } from '../core/form-errors';
import { QuizHtml } from '../quizzes/quiz-html';
import { CorrectedQuestions } from './corrected-questions';
import { GradingApi } from './grading-api';

type MarksForm = FormGroup<{ marks: FormArray<FormControl<number | null>>; comment: FormControl<string> }>;

/**
 * `/grading`: written answers from the instructor's cohorts waiting for a grade, oldest first.
 * Opening one shows the question, the answer (as text) and the rubric with a points field per
 * criterion; saving scores the attempt again and e-mails the apprentice.
 */
@Component({
  selector: 'fl-grading-queue-page',
  imports: [CorrectedQuestions, DatePipe, MatButton, MatError, MatFormField, MatHint, MatInput, MatLabel, QuizHtml, ReactiveFormsModule, RouterLink],
  templateUrl: './grading-queue-page.html',
  styleUrl: './grading.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GradingQueuePage {
  private readonly api = inject(GradingApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly injector = inject(Injector);
  private readonly formElement = viewChild<ElementRef<HTMLFormElement>>('formElement');
  private readonly answerHeading = viewChild<ElementRef<HTMLElement>>('answerHeading');
  private readonly queueHeading = viewChild<ElementRef<HTMLElement>>('queueHeading');

  protected readonly queue = this.api.queue();
  /** Answers graded on this visit, taken off the list without a reload. */
  private readonly done = signal<ReadonlySet<string>>(new Set());
  protected readonly items = computed(() => (this.queue.hasValue() ? this.queue.value().items.filter((i) => !this.done().has(i.responseId)) : []));
  protected readonly waiting = computed(() => (this.queue.hasValue() ? this.queue.value().total - this.done().size : 0));
  protected readonly selected = signal<GradingQueueItem | null>(null);
  protected readonly form = signal<MarksForm | null>(null);
  protected readonly saving = signal(false);
  protected readonly saved = signal<string | null>(null);
  protected readonly errorOf = fieldError;
  protected readonly commentMessages = { maxlength: 'Keep the comment under 4000 characters.' };

  protected pointsMessages(max: number): Record<string, string> {
    return { required: 'Give points for this criterion (0 if it is missing).', min: 'No fewer than 0 points.', max: `No more than ${max} points.` };
  }

  protected total(form: MarksForm): number {
    return Math.round(form.controls.marks.controls.reduce((sum, c) => sum + (Number(c.value) || 0), 0) * 100) / 100;
  }

  protected open(item: GradingQueueItem): void {
    this.saved.set(null);
    this.selected.set(item);
    this.form.set(
      this.fb.group({
        marks: new FormArray(item.rubric.map((c) => new FormControl<number | null>(null, [Validators.required, Validators.min(0), Validators.max(c.points)]))),
        comment: this.fb.control('', [Validators.maxLength(4000)]),
      }),
    );
    focusAfterRender(() => this.answerHeading()?.nativeElement, this.injector);
  }

  protected close(): void {
    this.selected.set(null);
    this.form.set(null);
    focusAfterRender(() => this.queueHeading()?.nativeElement, this.injector);
  }

  protected async save(): Promise<void> {
    const item = this.selected();
    const form = this.form();
    if (!item || !form) return;
    await submitForm({
      form,
      element: this.formElement()?.nativeElement,
      injector: this.injector,
      busy: this.saving,
      send: async () => {
        const { marks, comment } = form.getRawValue();
        const graded = await this.api.grade(item.responseId, {
          marks: item.rubric.map((c, i) => ({ criterion: c.criterion, points: Number(marks[i]) })),
          comment,
        });
        this.done.update((set) => new Set([...set, item.responseId]));
        const score = Math.round(graded.attempt.percent * 10) / 10;
        this.saved.set(
          `Saved: ${graded.points} of ${graded.maxPoints} points for ${item.apprentice.displayName}. The attempt now scores ${score} %` +
            `${graded.attempt.pendingCount > 0 ? ' (other answers still wait)' : graded.attempt.passed ? ', a pass' : ', not yet a pass'}. ` +
            'They get an e-mail and a notification, and see your marks with their result.',
        );
        this.selected.set(null);
        this.form.set(null);
        focusAfterRender(() => this.queueHeading()?.nativeElement, this.injector);
      },
    });
  }
}
