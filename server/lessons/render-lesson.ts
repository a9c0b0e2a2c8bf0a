import matter from 'gray-matter';
import { Marked, type Tokens } from 'marked';
import markedKatex from 'marked-katex-extension';

import type { LessonEmbed, LessonResultCheck, TocEntry } from '../../shared/api/lessons';
import { frontMatterSchema, type FrontMatter } from './front-matter';
import { lessonBlocks, type BlockCollector } from './lesson-blocks';
import { sanitizeLessonHtml } from './sanitize';

export interface RenderedLesson {
  meta: FrontMatter;
  html: string;
  toc: TocEntry[];
  embeds: LessonEmbed[];
  results: LessonResultCheck[];
  /** Every heading id, for checking `#anchor` links into this lesson. */
  anchors: string[];
  wordCount: number;
}

export class LessonRenderError extends Error {}

/** Heading ids: the text in lower case, runs of other characters as one hyphen. */
export function headingId(text: string): string {
  return text
    .toLowerCase()
    .replace(/<[^>]+>/g, '')
    .replace(/&[a-z]+;/g, '')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '');
}

export interface RenderOptions {
  /** The SVG source of a `:::figure <stem>` block, or undefined when there is none. */
  figure?: (stem: string) => string | undefined;
}

/** Markdown (with front matter, KaTeX and our blocks) → sanitised HTML plus what the page needs. */
export function renderLesson(source: string, fileName: string, options: RenderOptions = {}): RenderedLesson {
  const parsed = matter(source);
  const meta = frontMatterSchema.safeParse(parsed.data);
  if (!meta.success) {
    throw new LessonRenderError(`${fileName}: front matter: ${meta.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
  }
  const collector: BlockCollector = { embeds: [], results: [], figure: options.figure ?? (() => undefined) };
  const toc: TocEntry[] = [];
  const anchors: string[] = [];
  const marked = new Marked(
    // throwOnError: a formula KaTeX cannot parse fails the render (and so the content tests).
    markedKatex({ throwOnError: true, output: 'htmlAndMathml', nonStandard: true }),
    lessonBlocks(collector),
    {
      async: false,
      gfm: true,
      renderer: {
        heading(this: { parser: { parseInline: (t: Tokens.Generic[]) => string } }, token: Tokens.Heading) {
          const inner = this.parser.parseInline(token.tokens);
          const id = headingId(token.text);
          anchors.push(id);
          if (token.depth === 2 || token.depth === 3) toc.push({ id, text: token.text.replace(/\$([^$]*)\$/g, '$1').replace(/[*_`]/g, '').trim(), level: token.depth });
          return `<h${token.depth} id="${id}">${inner}</h${token.depth}>\n`;
        },
      },
    },
  );
  let html: string;
  try {
    html = marked.parse(parsed.content) as string;
  } catch (error) {
    throw new LessonRenderError(`${fileName}: ${error instanceof Error ? error.message : String(error)}`);
  }
  return {
    meta: meta.data,
    html: sanitizeLessonHtml(html),
    toc,
    embeds: collector.embeds.map((embed, index) => ({ index, ...embed })),
    results: collector.results.map((result, index) => ({ index, ...result })),
    anchors,
    wordCount: countWords(parsed.content),
  };
}

/** Prose words only: no front matter, mathematics, block markers or result lines. */
function countWords(markdown: string): number {
  const prose = markdown
    .replace(/\$\$[\s\S]*?\$\$/g, ' ')
    .replace(/\$[^$\n]*\$/g, ' ')
    .replace(/^:::calculator[\s\S]*?^:::/gm, ' ')
    .replace(/^=>.*$/gm, ' ')
    .replace(/^:::.*$/gm, ' ');
  return prose.split(/\s+/).filter((w) => /[A-Za-z]/.test(w)).length;
}
