import { zodResolver } from '@hookform/resolvers/zod';
import type { FieldValues, Resolver } from 'react-hook-form';
import type { z } from 'zod';

/**
 * Validates a form with the server's own schema. The inputs hold what a person types (NaN for
 * an empty number, '' for an unchosen option); `toBody` turns that into the request body, so
 * the schema sees exactly what the server will, and its issue paths still name the fields.
 */
export function bodyResolver<Values extends FieldValues, Schema extends z.ZodType<FieldValues, FieldValues>>(
  schema: Schema,
  toBody: (values: Values) => z.input<Schema>,
): Resolver<Values, unknown, z.output<Schema>> {
  const inner = zodResolver(schema) as unknown as Resolver<FieldValues, unknown, z.output<Schema>>;
  return (values, context, options) =>
    inner(toBody(values), context, options as unknown as Parameters<typeof inner>[2]) as ReturnType<Resolver<Values, unknown, z.output<Schema>>>;
}
