import { Migration } from '@mikro-orm/migrations';

export class Migration20261202004802 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "dishes" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "organisation_id" uuid not null, "name" varchar(200) not null, "method" varchar(16) not null, "servings_per_batch" int not null, "food_kg_per_serving" double precision not null, "water_kg_per_serving" double precision not null, "food_cp_jper_kg_k" double precision not null, "litres_per_serving" double precision not null, "min_pot_temp_c" double precision not null, "hold_min" double precision not null, "safe_core_temp_c" double precision not null, "lid_on" boolean not null default true, "backup_stove" varchar(32) not null, "notes" varchar(1000) null, "archived" boolean not null default false, constraint "dishes_pkey" primary key ("id"));`);
    this.addSql(`alter table "dishes" add constraint "dishes_organisation_id_name_unique" unique ("organisation_id", "name");`);

    this.addSql(`create table "menu_lines" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "kitchen_id" uuid not null, "date" varchar(10) not null, "dish_id" uuid not null, "servings" int not null, "serve_by" varchar(5) not null, "earliest_start" varchar(5) null, "position" int not null default 0, constraint "menu_lines_pkey" primary key ("id"));`);
    this.addSql(`create index "menu_lines_kitchen_id_date_index" on "menu_lines" ("kitchen_id", "date");`);

    this.addSql(`create table "plans" ("id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "kitchen_id" uuid not null, "date" varchar(10) not null, "version" int not null, "status" varchar(16) not null, "created_by_id" uuid null, "published_at" timestamptz null, "published_by_id" uuid null, "weather_source" varchar(32) not null, "batches" jsonb not null, "result" jsonb not null, "fuel" jsonb not null, "cookers" jsonb not null, constraint "plans_pkey" primary key ("id"));`);
    this.addSql(`create index "plans_kitchen_id_date_status_index" on "plans" ("kitchen_id", "date", "status");`);

    this.addSql(`alter table "dishes" add constraint "dishes_organisation_id_foreign" foreign key ("organisation_id") references "organisations" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "menu_lines" add constraint "menu_lines_kitchen_id_foreign" foreign key ("kitchen_id") references "kitchens" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "menu_lines" add constraint "menu_lines_dish_id_foreign" foreign key ("dish_id") references "dishes" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "plans" add constraint "plans_kitchen_id_foreign" foreign key ("kitchen_id") references "kitchens" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "plans" add constraint "plans_created_by_id_foreign" foreign key ("created_by_id") references "users" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "plans" add constraint "plans_published_by_id_foreign" foreign key ("published_by_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "kitchens" add column "planning" jsonb not null default '{"shiftStart":"06:00","shiftEnd":"19:00","turnaroundMin":15,"currency":"USD","fuels":[{"stoveId":"lpg"},{"stoveId":"three-stone-wood"}]}';`);
    // A published (or superseded) version number is given once per kitchen and day.
    this.addSql(`create unique index "plans_kitchen_date_version_published" on "plans" ("kitchen_id", "date", "version") where "status" <> 'draft';`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "menu_lines" drop constraint "menu_lines_dish_id_foreign";`);

    this.addSql(`drop table if exists "dishes" cascade;`);

    this.addSql(`drop table if exists "menu_lines" cascade;`);

    this.addSql(`drop table if exists "plans" cascade;`);

    this.addSql(`alter table "kitchens" drop column "planning";`);
  }

}
