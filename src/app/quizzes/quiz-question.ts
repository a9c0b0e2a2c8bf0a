import { ChangeDetectionStrategy, Component, DOCUMENT, DestroyRef, type OnInit, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { MatOption, MatSelect } from '@angular/material/select';
import type { AbstractControl } from '@angular/forms';

import type { AttemptQuestion } from '../../../shared/api/quizzes';
import { unitLabel } from '../calculators/unit-labels';
import { AnswerSaver, type SaveState } from './answer-saver';
import { type AnswerDraft, draftOf, serialiseAnswer } from './quiz-answers';
import { QuizHtml } from './quiz-html';
import { QuizzesApi, saveFailureOf } from './quizzes-api';

/**
 * One question of an open attempt: its stem, the field that answers it (radios, checkboxes, a
 * number with a unit picker, or text) and a quiet line saying whether the answer is saved. Every
 * change saves itself (debounced); a refusal shows under the question and keeps what was typed.
 */
@Component({
  selector: 'fl-quiz-question',
  imports: [MatCheckbox, MatFormField, MatHint, MatInput, MatLabel, MatOption, MatRadioButton, MatRadioGroup, MatSelect, QuizHtml, ReactiveFormsModule],
  templateUrl: './quiz-question.html',
  styleUrl: './quiz-question.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QuizQuestion implements OnInit {
  readonly question = input.required<AttemptQuestion>();
  readonly number = input.required<number>();
  readonly attemptId = input.required<string>();

  private readonly api = inject(QuizzesApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly window = inject(DOCUMENT).defaultView;
  private saver?: AnswerSaver;

  protected readonly unitLabel = unitLabel;
  protected readonly saveState = signal<SaveState>({ status: 'unchanged' });
  protected readonly ids = computed(() => {
    const base = `question-${this.question().id}`;
    return { stem: `${base}-stem`, state: `${base}-state`, hint: `${base}-hint` };
  });
  protected readonly problem = computed(() => {
    const state = this.saveState();
    return state.status === 'refused' || state.status === 'closed' || state.status === 'retrying' ? state.message : null;
  });

  // One form per kind; only the one for this question's kind is used.
  protected readonly single = new FormControl<string | null>(null);
  protected readonly multiple = new FormGroup<Record<string, FormControl<boolean>>>({});
  protected readonly numeric = new FormGroup({
    text: new FormControl('', { nonNullable: true }),
    unit: new FormControl('', { nonNullable: true }),
  });
  protected readonly written = new FormControl('', { nonNullable: true });

  ngOnInit(): void {
    const question = this.question();
    const draft = draftOf(question);
    let form: AbstractControl;
    switch (draft.kind) {
      case 'single':
        this.single.setValue(draft.choiceId);
        form = this.single;
        break;
      case 'multiple':
        for (const choice of question.choices ?? []) {
          this.multiple.addControl(choice.id, new FormControl(draft.choiceIds.includes(choice.id), { nonNullable: true }));
        }
        form = this.multiple;
        break;
      case 'number':
        this.numeric.setValue({ text: draft.text, unit: draft.unit });
        form = this.numeric;
        break;
      case 'written':
        this.written.setValue(draft.text);
        form = this.written;
        break;
    }
    if (question.answer !== null) this.saveState.set({ status: 'saved', at: '' });

    this.saver = new AnswerSaver(
      async (answer) => this.api.saveAnswer(this.attemptId(), question.id, answer),
      saveFailureOf,
      (state) => this.saveState.set(state),
    );
    form.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => this.saver?.change(serialiseAnswer(this.draft())));

    // Back online: send what waits at once.
    const online = () => this.saver?.retryNow();
    this.window?.addEventListener('online', online);
    this.destroyRef.onDestroy(() => {
      this.window?.removeEventListener('online', online);
      this.saver?.dispose();
    });
  }

  /** Sends what waits now (before submit); resolves with where the answer stands. */
  async flush(): Promise<SaveState> {
    return this.saver ? this.saver.flush() : this.saveState();
  }

  /** Whether anything is given (for the "answered" count before submit). */
  answered(): boolean {
    const serialised = serialiseAnswer(this.draft());
    if (!serialised.ok) return true;
    const answer = serialised.answer;
    return answer !== null && !('choiceIds' in answer && answer.choiceIds.length === 0);
  }

  private draft(): AnswerDraft {
    switch (this.question().kind) {
      case 'single':
        return { kind: 'single', choiceId: this.single.value };
      case 'multiple':
        return { kind: 'multiple', choiceIds: (this.question().choices ?? []).map((c) => c.id).filter((id) => this.multiple.controls[id]?.value === true) };
      case 'numeric':
      case 'fresh':
        return { kind: 'number', ...this.numeric.getRawValue() };
      case 'written':
        return { kind: 'written', text: this.written.value };
    }
  }
}
