import { OrganisationSchema } from './organisation';
import { KitchenSchema } from './kitchen';
import { UserSchema } from './user';
import { MembershipSchema } from './membership';
import { InvitationSchema } from './invitation';
import { PasswordResetSchema } from './password-reset';
import { AuditEventSchema } from './audit-event';
import { StorageMediumSchema } from './storage-medium';
import { CookerSchema } from './cooker';
import { DishSchema } from './dish';
import { MenuLineSchema } from './menu-line';
import { PlanSchema } from './plan';
import { ForecastSchema } from './forecast';
import { ForecastPointSchema } from './forecast-point';
import { CheckInSchema } from './check-in';
import { ReadingSchema } from './reading';
import { IdempotencyRecordSchema } from './idempotency-record';
import { PushSubscriptionSchema } from './push-subscription';
import { CookerApiKeySchema } from './cooker-api-key';
import { RateLimitSchema } from './rate-limit';
import { SettingSchema } from './setting';
import { AlertJobSchema } from './alert-job';

export * from './base';
export * from './organisation';
export * from './kitchen';
export * from './user';
export * from './membership';
export * from './invitation';
export * from './password-reset';
export * from './audit-event';
export * from './storage-medium';
export * from './cooker';
export * from './dish';
export * from './menu-line';
export * from './plan';
export * from '@/lib/plan-records';
export * from './forecast';
export * from './forecast-point';
export * from './check-in';
export * from './reading';
export * from './idempotency-record';
export * from './push-subscription';
export * from './cooker-api-key';
export * from './rate-limit';
export * from './setting';
export * from './alert-job';

/** Every entity, listed explicitly for mikro-orm.config.ts. */
export const allEntities = [
  OrganisationSchema,
  KitchenSchema,
  UserSchema,
  MembershipSchema,
  InvitationSchema,
  PasswordResetSchema,
  AuditEventSchema,
  StorageMediumSchema,
  CookerSchema,
  DishSchema,
  MenuLineSchema,
  PlanSchema,
  ForecastSchema,
  ForecastPointSchema,
  CheckInSchema,
  ReadingSchema,
  IdempotencyRecordSchema,
  PushSubscriptionSchema,
  CookerApiKeySchema,
  RateLimitSchema,
  SettingSchema,
  AlertJobSchema,
];
