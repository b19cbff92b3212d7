import { JsonType, type Platform, type TransformContext } from '@mikro-orm/core';
import type { z } from 'zod';
import { PlanRecordError } from '@/lib/plan-records';

/**
 * The type of a JSON column whose value is parsed with a zod schema when it is read. A class of its
 * own per column, with no constructor arguments: the ORM makes its own instances of a property's type.
 */
export function planRecordType<T>(schema: z.ZodType<T>, column: string) {
  return class PlanRecordType extends JsonType {
    override convertToJSValue(value: unknown, platform: Platform, context?: TransformContext): T {
      const raw = super.convertToJSValue(value, platform, context);
      const r = schema.safeParse(raw);
      if (!r.success) throw new PlanRecordError(column, r.error.issues);
      return r.data;
    }
  };
}
