import { z } from 'zod';

/** The front matter every lesson file must carry (see content/README.md). */
export const frontMatterSchema = z
  .object({
    title: z.string().min(3),
    slug: z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'lower-case words joined by hyphens'),
    order: z.number().int().min(1),
    summary: z.string().min(20),
    minutes: z.number().int().min(5).max(120),
    free: z.boolean(),
    objectives: z.array(z.string().min(5)).min(3).max(6),
    /** Objectives assessed at the bench on the lab sheet, signed off by an instructor. */
    labObjectives: z.array(z.string().min(5)).max(4).default([]),
    glossary: z.array(z.object({ term: z.string().min(2), definition: z.string().min(10) }).strict()).default([]),
  })
  .strict();

export type FrontMatter = z.infer<typeof frontMatterSchema>;
