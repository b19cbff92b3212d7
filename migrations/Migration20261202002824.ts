import { Migration } from '@mikro-orm/migrations';

export class Migration20261202002824 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "audit_events" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "organisation_id" uuid not null, "kitchen_id" uuid null, "actor_id" uuid null, "action" varchar(64) not null, "entity_type" varchar(64) not null, "entity_id" varchar(64) not null, "details" jsonb null, constraint "audit_events_pkey" primary key ("id"));`);
    this.addSql(`create index "audit_events_organisation_id_index" on "audit_events" ("organisation_id");`);

    this.addSql(`create table "login_attempts" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "key" varchar(400) not null, constraint "login_attempts_pkey" primary key ("id"));`);
    this.addSql(`create index "login_attempts_key_created_at_index" on "login_attempts" ("key", "created_at");`);

    this.addSql(`create table "organisations" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "name" varchar(200) not null, constraint "organisations_pkey" primary key ("id"));`);

    this.addSql(`create table "kitchens" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "organisation_id" uuid not null, "name" varchar(200) not null, "latitude" double precision not null, "longitude" double precision not null, "altitude_m" double precision not null, "time_zone" varchar(64) not null, "locale" varchar(8) not null default 'en', constraint "kitchens_pkey" primary key ("id"));`);

    this.addSql(`create table "users" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "email" varchar(320) not null, "password_hash" varchar(100) null, "name" varchar(200) not null, "locale" varchar(8) not null default 'en', "temperature_unit" varchar(1) not null default 'C', constraint "users_pkey" primary key ("id"));`);
    this.addSql(`alter table "users" add constraint "users_email_unique" unique ("email");`);

    this.addSql(`create table "password_resets" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "user_id" uuid not null, "token_hash" varchar(64) not null, "expires_at" timestamptz not null, "used_at" timestamptz null, constraint "password_resets_pkey" primary key ("id"));`);
    this.addSql(`alter table "password_resets" add constraint "password_resets_token_hash_unique" unique ("token_hash");`);

    this.addSql(`create table "memberships" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "user_id" uuid not null, "organisation_id" uuid not null, "kitchen_id" uuid null, "role" varchar(16) not null, constraint "memberships_pkey" primary key ("id"));`);
    this.addSql(`alter table "memberships" add constraint "memberships_user_id_organisation_id_kitchen_id_role_unique" unique ("user_id", "organisation_id", "kitchen_id", "role");`);

    this.addSql(`create table "invitations" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "email" varchar(320) not null, "token_hash" varchar(64) not null, "role" varchar(16) not null, "organisation_id" uuid not null, "kitchen_id" uuid null, "invited_by_id" uuid not null, "expires_at" timestamptz not null, "accepted_at" timestamptz null, constraint "invitations_pkey" primary key ("id"));`);
    this.addSql(`alter table "invitations" add constraint "invitations_token_hash_unique" unique ("token_hash");`);

    this.addSql(`alter table "kitchens" add constraint "kitchens_organisation_id_foreign" foreign key ("organisation_id") references "organisations" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "password_resets" add constraint "password_resets_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "memberships" add constraint "memberships_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "memberships" add constraint "memberships_organisation_id_foreign" foreign key ("organisation_id") references "organisations" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "memberships" add constraint "memberships_kitchen_id_foreign" foreign key ("kitchen_id") references "kitchens" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "invitations" add constraint "invitations_organisation_id_foreign" foreign key ("organisation_id") references "organisations" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "invitations" add constraint "invitations_kitchen_id_foreign" foreign key ("kitchen_id") references "kitchens" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "invitations" add constraint "invitations_invited_by_id_foreign" foreign key ("invited_by_id") references "users" ("id") on update cascade on delete cascade;`);
  }

}
