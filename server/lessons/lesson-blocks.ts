import type { MarkedExtension, Tokens } from 'marked';

import type { InputValue } from '../../shared/airflow';
import { parsePresetLines, parseResultLine, type ResultLine } from './preset-values';

/** What the blocks of one lesson collect while it renders. */
export interface BlockCollector {
  embeds: Array<{ calculator: string; inputs: Record<string, InputValue> }>;
  results: ResultLine[];
  /** The SVG source of a figure by its stem, or undefined when there is none. */
  figure: (stem: string) => string | undefined;
}

const BLOCK = /^:::([a-z-]+)[ \t]*([^\n]*)\n([\s\S]*?)\n?^:::[ \t]*(?:\n+|$)/m;
const KINDS = new Set(['calculator', 'example', 'key-idea', 'caution', 'check', 'mistakes', 'figure']);

interface FlowloreBlock extends Tokens.Generic {
  kind: string;
  arg: string;
  titleTokens: Tokens.Generic[];
  index: number;
  resultIndexes: number[];
  svg?: string;
}

/** Our block syntax (content/README.md) as a marked extension. Unknown blocks fail the render. */
export function lessonBlocks(collector: BlockCollector): MarkedExtension {
  return {
    extensions: [
      {
        name: 'flowloreBlock',
        level: 'block',
        start: (src: string) => src.match(/^:::[a-z]/m)?.index,
        tokenizer(src: string) {
          if (!src.startsWith(':::')) return undefined;
          const match = BLOCK.exec(src);
          if (!match || match.index !== 0) throw new Error(`block starting "${src.split('\n')[0]}" is not closed by ::: on its own line`);
          const [raw, kind, arg, body] = match as unknown as [string, string, string, string];
          if (!KINDS.has(kind)) throw new Error(`unknown block ":::${kind}"`);
          const token: FlowloreBlock = { type: 'flowloreBlock', raw, kind, arg: arg.trim(), tokens: [], titleTokens: [], index: -1, resultIndexes: [] };
          if (kind === 'calculator') {
            token.index = collector.embeds.push({ calculator: token.arg, inputs: parsePresetLines(body) }) - 1;
            return token;
          }
          const prose = body
            .split('\n')
            .filter((line) => {
              if (kind !== 'example' || !line.trim().startsWith('=>')) return true;
              token.resultIndexes.push(collector.results.push(parseResultLine(line.trim())) - 1);
              return false;
            })
            .join('\n');
          if (kind === 'figure') {
            token.svg = collector.figure(token.arg);
            if (token.svg === undefined) throw new Error(`figure "${token.arg}" has no file content/figures/${token.arg}.svg`);
            if (!/<title[\s>]/.test(token.svg) || !/<desc[\s>]/.test(token.svg)) throw new Error(`figure "${token.arg}" needs a <title> and a <desc> (its text alternative)`);
            if (!body.trim()) throw new Error(`figure "${token.arg}" needs a caption`);
          }
          if (kind === 'example' && token.resultIndexes.length === 0) throw new Error(`worked example "${token.arg}" has no result line (=> …)`);
          this.lexer.blockTokens(prose, token.tokens ?? []);
          this.lexer.inlineTokens(token.arg, token.titleTokens);
          return token;
        },
        renderer(generic: Tokens.Generic) {
          const token = generic as FlowloreBlock;
          const body = () => this.parser.parse(token.tokens ?? []);
          const title = () => this.parser.parseInline(token.titleTokens);
          switch (token.kind) {
            case 'calculator':
              return `<div class="lesson-calculator" data-embed="${token.index}"></div>\n`;
            case 'example': {
              const tries = token.resultIndexes.map((i) => `<div class="lesson-try" data-try="${i}"></div>`).join('');
              return `<section class="lesson-example" aria-label="Worked example"><p class="lesson-block-label">Worked example: ${title()}</p>${body()}${tries}</section>\n`;
            }
            case 'key-idea':
              return `<aside class="lesson-key-idea" aria-label="Key idea"><p class="lesson-block-label">Key idea</p>${body()}</aside>\n`;
            case 'mistakes':
              return `<aside class="lesson-mistakes" aria-label="Common mistakes"><p class="lesson-block-label">Common mistakes</p>${body()}</aside>\n`;
            case 'figure':
              return `<figure class="lesson-figure">${token.svg!.replace(/^\s*<\?xml[^>]*>\s*/, '')}<figcaption>${body()}</figcaption></figure>\n`;
            case 'caution':
              return `<aside class="lesson-caution" role="note" aria-label="Caution"><p class="lesson-block-label">Caution</p>${body()}</aside>\n`;
            default:
              return `<details class="lesson-check"><summary>Check yourself: ${title()}</summary><div class="lesson-check-answer">${body()}</div></details>\n`;
          }
        },
      },
    ],
  };
}
