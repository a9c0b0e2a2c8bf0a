import { escapeHtml, htmlFrame, type RenderedMail } from './layout';

/** An instructor graded an apprentice's written answer: the points, the quiz's score now, and a link to the result. */
export function answerGradedMail({
  name,
  quizTitle,
  points,
  maxPoints,
  scorePercent,
  passed,
  stillWaiting,
  link,
}: {
  name: string;
  quizTitle: string;
  points: number;
  maxPoints: number;
  scorePercent: number;
  passed: boolean;
  /** Other written answers of the attempt still waiting for a grade. */
  stillWaiting: number;
  link: string;
}): RenderedMail {
  const subject = `Your answer in "${quizTitle}" is graded`;
  const score = `${formatNumber(scorePercent)} %`;
  const status = stillWaiting > 0
    ? `Your score is now ${score}. ${stillWaiting === 1 ? 'One more written answer is' : `${stillWaiting} more written answers are`} still waiting for your instructor.`
    : `Your score is ${score}: ${passed ? 'you passed this quiz' : 'not yet a pass'}.`;
  const text = [
    `Hello ${name},`,
    '',
    `Your instructor graded your written answer in "${quizTitle}": ${formatNumber(points)} of ${formatNumber(maxPoints)} points.`,
    status,
    'Open your result to read the marks for each point and your instructor\'s comment:',
    link,
  ].join('\n');
  const html = htmlFrame(
    subject,
    [
      `Hello ${escapeHtml(name)},`,
      `Your instructor graded your written answer in <strong>${escapeHtml(quizTitle)}</strong>: ${escapeHtml(formatNumber(points))} of ${escapeHtml(formatNumber(maxPoints))} points.`,
      escapeHtml(status),
      'Open your result to read the marks for each point and your instructor&#39;s comment.',
    ],
    { href: link, label: 'Open my result' },
  );
  return { template: 'answer-graded', subject, text, html };
}

/** 7.5 → "7.5", 68.181818 → "68.2", 10 → "10". */
function formatNumber(x: number): string {
  return String(Math.round(x * 10) / 10);
}
