import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatPaginator, type PageEvent } from '@angular/material/paginator';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSort, MatSortHeader, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { debounceTime, distinctUntilChanged, map } from 'rxjs';

import {
  GRADEBOOK_QUIZ_STATUSES,
  GRADEBOOK_STATUS_WORDS,
  needsHelpWords,
  type GradebookCell,
  type GradebookPage,
  type GradebookQuery,
  type GradebookQuizStatus,
  type GradebookRow,
} from '../../../shared/api/gradebook';
import { GradebookApi } from './gradebook-api';

type StatusFilter = GradebookQuizStatus | 'needs-help' | '';

/**
 * A cohort's gradebook: apprentices as rows, a column per quiz (best score and status in words,
 * coloured as well), completion, last activity and a "needs help" marker in words. Sorting,
 * filtering and paging happen on the server; the CSV link downloads every row in the same order.
 */
@Component({
  selector: 'fl-gradebook',
  imports: [
    DatePipe,
    DecimalPipe,
    MatAnchor,
    MatButton,
    MatFormField,
    MatInput,
    MatLabel,
    MatOption,
    MatPaginator,
    MatSelect,
    MatSort,
    MatSortHeader,
    MatTableModule,
    ReactiveFormsModule,
  ],
  templateUrl: './gradebook.html',
  styleUrls: ['../admin/admin-tables.scss', './gradebook.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Gradebook {
  private readonly api = inject(GradebookApi);
  readonly cohortId = input.required<string>();

  protected readonly statusWords = GRADEBOOK_STATUS_WORDS;
  protected readonly statuses = GRADEBOOK_QUIZ_STATUSES;

  protected readonly search = new FormControl('', { nonNullable: true });
  protected readonly statusFilter = new FormControl<StatusFilter>('', { nonNullable: true });
  protected readonly quizFilter = new FormControl('', { nonNullable: true });
  private readonly q = toSignal(
    this.search.valueChanges.pipe(
      debounceTime(300),
      map((text) => text.trim()),
      distinctUntilChanged(),
    ),
    { initialValue: '' },
  );
  private readonly status = toSignal(this.statusFilter.valueChanges, { initialValue: '' as StatusFilter });
  private readonly quiz = toSignal(this.quizFilter.valueChanges, { initialValue: '' });
  protected readonly sort = signal<{ active: string; direction: 'asc' | 'desc' }>({ active: 'name', direction: 'asc' });
  protected readonly paging = signal({ pageIndex: 0, pageSize: 50 });

  private readonly filters = computed(() => {
    const status = this.status();
    return {
      sort: this.sort().active,
      dir: this.sort().direction,
      status: status || undefined,
      quiz: status && status !== 'needs-help' ? this.quiz() || undefined : undefined,
      q: this.q() || undefined,
    };
  });
  private readonly query = computed<GradebookQuery>(() => ({ ...this.filters(), page: this.paging().pageIndex + 1, pageSize: this.paging().pageSize }));
  protected readonly book = this.api.page(this.cohortId, this.query);
  /** The last page that arrived, kept on screen while the next one loads. */
  protected readonly shown = linkedSignal<GradebookPage | undefined, GradebookPage | undefined>({
    source: () => (this.book.hasValue() ? this.book.value() : undefined),
    computation: (next, previous) => next ?? previous?.value,
  });
  protected readonly columns = computed(() => ['name', ...(this.shown()?.quizzes ?? []).map((q) => `quiz:${q.slug}`), 'lessons', 'quizzesPassed', 'lastActivity', 'needsHelp']);
  protected readonly csvUrl = computed(() => this.api.csvUrl(this.cohortId(), this.filters()));

  constructor() {
    // A new search or filter starts again at the first page.
    this.search.valueChanges.pipe(debounceTime(300), takeUntilDestroyed()).subscribe(() => this.firstPage());
    this.statusFilter.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.firstPage());
    this.quizFilter.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.firstPage());
  }

  /** Asks the server again (after the cohort's members changed). */
  reload(): void {
    this.book.reload();
  }

  private firstPage(): void {
    this.paging.update((p) => ({ ...p, pageIndex: 0 }));
  }

  protected sortBy(sort: Sort): void {
    this.sort.set(sort.direction ? { active: sort.active, direction: sort.direction } : { active: 'name', direction: 'asc' });
    this.firstPage();
  }

  protected turnPage(event: PageEvent): void {
    this.paging.set({ pageIndex: event.pageIndex, pageSize: event.pageSize });
  }

  protected cellOf(row: GradebookRow, slug: string): GradebookCell {
    return row.quizzes[slug] ?? { status: 'not-started', bestPercent: null, attemptsUsed: 0, failedAttempts: 0 };
  }

  protected reasons(row: GradebookRow): string {
    const page = this.shown();
    const title = (slug: string) => page?.quizzes.find((q) => q.slug === slug)?.title ?? slug;
    return row.needsHelpReasons.map((r) => needsHelpWords(r, title)).join('; ');
  }
}
