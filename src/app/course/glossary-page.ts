import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { RouterLink } from '@angular/router';

import type { GlossaryEntry } from '../../../shared/api/lessons';
import { LessonsService } from './lessons.service';

const alphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ'.split('');

interface Letter {
  readonly letter: string;
  readonly id: string;
  readonly entries: readonly GlossaryEntry[];
}

/** The letter a term is filed under: its first letter without accents, or "#" for a digit or symbol. */
function fileUnder(term: string): string {
  const first = term.normalize('NFD').charAt(0).toUpperCase();
  return alphabet.includes(first) ? first : '#';
}

/** Every term the lessons define, A to Z, each with a link to the lesson that defines it. */
@Component({
  selector: 'fl-glossary-page',
  imports: [MatButton, RouterLink],
  templateUrl: './glossary-page.html',
  styleUrl: './glossary-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GlossaryPage {
  protected readonly glossary = inject(LessonsService).glossary();

  protected readonly letters = computed<readonly Letter[]>(() => {
    if (!this.glossary.hasValue()) return [];
    const byLetter = new Map<string, GlossaryEntry[]>();
    const sorted = [...(this.glossary.value() ?? [])].sort((a, b) => a.term.localeCompare(b.term, 'en'));
    for (const entry of sorted) {
      const letter = fileUnder(entry.term);
      byLetter.set(letter, [...(byLetter.get(letter) ?? []), entry]);
    }
    return [...byLetter]
      .sort(([a], [b]) => (a === '#' ? 1 : b === '#' ? -1 : a.localeCompare(b)))
      .map(([letter, entries]) => ({ letter, id: letter === '#' ? 'letter-other' : `letter-${letter.toLowerCase()}`, entries }));
  });

  /** A to Z, each a link when some term is filed under it. */
  protected readonly index = computed(() => {
    const present = new Map(this.letters().map((group) => [group.letter, group.id]));
    return alphabet.map((letter) => ({ letter, id: present.get(letter) }));
  });

  protected retry(): void {
    this.glossary.reload();
  }
}
