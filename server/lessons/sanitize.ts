import createDOMPurify from 'dompurify';
import { JSDOM } from 'jsdom';

const { window } = new JSDOM('');
const purify = createDOMPurify(window as unknown as Parameters<typeof createDOMPurify>[0]);

/**
 * DOMPurify over rendered lesson HTML: keeps ordinary HTML, KaTeX's MathML and its styled spans,
 * the figures' SVG (no style elements, scripts or event handlers),
 * and our data-embed/data-try placeholders; drops scripts, event handlers and javascript: URLs.
 */
export function sanitizeLessonHtml(html: string): string {
  return purify.sanitize(html, {
    USE_PROFILES: { html: true, mathMl: true, svg: true },
    ADD_TAGS: ['semantics', 'annotation'],
    ADD_ATTR: ['encoding', 'aria-hidden', 'aria-label', 'aria-labelledby', 'aria-describedby', 'role'],
    FORBID_TAGS: ['style', 'form', 'input', 'button', 'iframe'],
  });
}

/** The links of a piece of HTML, for the content tests and the link checker. */
export function linksIn(html: string): string[] {
  const doc = new JSDOM(html).window.document;
  return [...doc.querySelectorAll('a[href]')].map((a) => a.getAttribute('href') ?? '');
}
