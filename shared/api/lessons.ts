import type { InputValue } from '../airflow';

/** One lesson in the course outline (`GET /api/lessons`). */
export interface LessonOutline {
  slug: string;
  title: string;
  order: number;
  summary: string;
  minutes: number;
  /** What the reader can do afterwards, assessed online. */
  objectives: string[];
  /** Objectives assessed at the bench on the lab sheet and signed off by an instructor. */
  labObjectives: string[];
  free: boolean;
}

export interface TocEntry {
  id: string;
  text: string;
  level: 2 | 3;
}

/** A live calculator placed in the lesson at `<div data-embed="index">`. */
export interface LessonEmbed {
  index: number;
  calculator: string;
  inputs: Record<string, InputValue>;
}

/** A worked example's result line, placed at `<div data-try="index">`: the engine reproduces it. */
export interface LessonResultCheck {
  index: number;
  calculator: string;
  inputs: Record<string, InputValue>;
  output: string;
  value: number;
  unit: string;
  tolerance: number;
}

/** `GET /api/lessons/:slug`: sanitised HTML with placeholders the client fills with live parts. */
export interface LessonPage extends LessonOutline {
  html: string;
  toc: TocEntry[];
  embeds: LessonEmbed[];
  results: LessonResultCheck[];
  previous: Pick<LessonOutline, 'slug' | 'title'> | null;
  next: Pick<LessonOutline, 'slug' | 'title'> | null;
}

/** `GET /api/glossary`: each term links to the lesson that defines it. */
export interface GlossaryEntry {
  term: string;
  definition: string;
  lesson: Pick<LessonOutline, 'slug' | 'title'>;
}
