import { z } from 'zod';

/**
 * `POST /api/calculators/:id` body. An input is `{ value, unit }` for a quantity, a bare number
 * for a dimensionless input, or a string naming an option. The engine checks the rest.
 */
export const calculationRequestSchema = z
  .object({
    inputs: z.record(
      z.string(),
      z.union([
        z.number(),
        z.string().max(100),
        z.object({ value: z.number(), unit: z.string().min(1).max(40) }).strict(),
      ]),
    ),
    outputUnits: z.record(z.string(), z.string().min(1).max(40)).optional(),
  })
  .strict();

export type CalculationRequestBody = z.infer<typeof calculationRequestSchema>;
