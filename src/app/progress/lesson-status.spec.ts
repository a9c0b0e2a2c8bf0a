import type { LessonOutline } from '../../../shared/api/lessons';
import type { QuizSummary } from '../../../shared/api/quizzes';
import { formatPercent, lessonStatus, progressRows } from './lesson-status';

const quiz = (over: Partial<QuizSummary>): QuizSummary => ({
  slug: 'pressure-drop',
  title: 'Pressure drop and restriction',
  questionCount: 9,
  totalPoints: 18,
  passMark: 80,
  attemptLimit: 3,
  timeLimitMinutes: null,
  attemptsUsed: 0,
  status: 'not-started',
  best: null,
  openAttempt: null,
  lastActivityAt: null,
  ...over,
});
const opened = { slug: 'pressure-drop', openedAt: '2026-03-02T09:00:00.000Z', finishedAt: null, lastActivityAt: '2026-03-02T09:10:00.000Z' };

describe('lesson status in words', () => {
  it('says where the apprentice is, the quiz first once started', () => {
    expect(lessonStatus(undefined, quiz({}))).toEqual({ tone: 'not-started', text: 'Not started' });
    expect(lessonStatus(opened, quiz({}))).toEqual({ tone: 'reading', text: 'Reading' });
    expect(lessonStatus({ ...opened, finishedAt: '2026-03-02T09:20:00.000Z' }, undefined).text).toBe('Read to the end');
    expect(lessonStatus(opened, quiz({ status: 'in-progress', attemptsUsed: 1 })).text).toBe('Quiz started');
    const passed = quiz({ status: 'passed', attemptsUsed: 2, best: { attemptId: 'x', scorePercent: 91.66666, passed: true, provisional: false } });
    expect(lessonStatus(opened, passed)).toEqual({ tone: 'passed', text: 'Quiz passed, best 91.7 %' });
    const waiting = quiz({ status: 'not-yet-passed', attemptsUsed: 1, best: { attemptId: 'x', scorePercent: 60, passed: false, provisional: true } });
    expect(lessonStatus(undefined, waiting)).toEqual({ tone: 'not-yet-passed', text: 'Quiz not yet passed, best 60 % so far' });
  });

  it('formats scores without float noise', () => {
    expect(formatPercent(80)).toBe('80 %');
    expect(formatPercent(87.5)).toBe('87.5 %');
    expect(formatPercent(100 * (7 / 9))).toBe('77.8 %');
  });

  it('lists every lesson in course order for "My progress"', () => {
    const outline = [
      { slug: 'volume-flow', order: 3, title: 'Volume flow' },
      { slug: 'pressure-drop', order: 2, title: 'Pressure drop and restriction' },
    ] as LessonOutline[];
    const rows = progressRows(outline, {
      lessons: [opened],
      quizzes: [quiz({ status: 'passed', attemptsUsed: 1, best: { attemptId: 'x', scorePercent: 100, passed: true, provisional: false } })],
      lastActivity: opened.lastActivityAt,
    });
    expect(rows.map((r) => r.slug)).toEqual(['pressure-drop', 'volume-flow']);
    expect(rows[0]).toMatchObject({ reading: 'Opened', quiz: 'Passed', best: '100 %', attempts: '1 of 3', lastActivity: opened.lastActivityAt });
    expect(rows[1]).toMatchObject({ reading: 'Not opened', quiz: 'No quiz', best: '—', attempts: '—', lastActivity: null });
  });

  it('takes a row’s last activity from its reading or its quiz, whichever is later', () => {
    const outline = [{ slug: 'pressure-drop', order: 2, title: 'Pressure drop and restriction' }] as LessonOutline[];
    const later = '2026-03-03T08:00:00.000Z';
    const rows = progressRows(outline, { lessons: [opened], quizzes: [quiz({ attemptsUsed: 1, lastActivityAt: later })], lastActivity: later });
    expect(rows[0]?.lastActivity).toBe(later);
    const quizOnly = progressRows(outline, { lessons: [], quizzes: [quiz({ attemptsUsed: 1, lastActivityAt: later })], lastActivity: later });
    expect(quizOnly[0]?.lastActivity).toBe(later);
  });
});
