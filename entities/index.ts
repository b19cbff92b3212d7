import { OrganisationSchema } from './organisation';
import { KitchenSchema } from './kitchen';
import { UserSchema } from './user';
import { MembershipSchema } from './membership';
import { InvitationSchema } from './invitation';
import { PasswordResetSchema } from './password-reset';
import { AuditEventSchema } from './audit-event';
import { LoginAttemptSchema } from './login-attempt';
import { StorageMediumSchema } from './storage-medium';
import { CookerSchema } from './cooker';
import { DishSchema } from './dish';
import { MenuLineSchema } from './menu-line';
import { PlanSchema } from './plan';
import { ForecastSchema } from './forecast';
import { ForecastPointSchema } from './forecast-point';

export * from './base';
export * from './organisation';
export * from './kitchen';
export * from './user';
export * from './membership';
export * from './invitation';
export * from './password-reset';
export * from './audit-event';
export * from './login-attempt';
export * from './storage-medium';
export * from './cooker';
export * from './dish';
export * from './menu-line';
export * from './plan';
export * from './forecast';
export * from './forecast-point';

/** Every entity, listed explicitly for mikro-orm.config.ts. */
export const allEntities = [
  OrganisationSchema,
  KitchenSchema,
  UserSchema,
  MembershipSchema,
  InvitationSchema,
  PasswordResetSchema,
  AuditEventSchema,
  LoginAttemptSchema,
  StorageMediumSchema,
  CookerSchema,
  DishSchema,
  MenuLineSchema,
  PlanSchema,
  ForecastSchema,
  ForecastPointSchema,
];
