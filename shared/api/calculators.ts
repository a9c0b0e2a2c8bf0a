import { z } from 'zod';

/**
 * `POST /api/calculators/:id` body. An input is `{ value, unit }` for a quantity, `{ values, unit }`
 * for a list of readings (at most 100 here; the engine holds each input to its own count), a bare
 * number for a dimensionless input, or a string naming an option. The engine checks the rest.
 */
export const calculationRequestSchema = z
  .object({
    inputs: z.record(
      z.string(),
      z.union([
        z.number(),
        z.string().max(100),
        z.object({ value: z.number(), unit: z.string().min(1).max(40) }).strict(),
        z.object({ values: z.array(z.number()).max(100), unit: z.string().min(1).max(40) }).strict(),
      ]),
    ),
    outputUnits: z.record(z.string(), z.string().min(1).max(40)).optional(),
  })
  .strict();

export type CalculationRequestBody = z.infer<typeof calculationRequestSchema>;
