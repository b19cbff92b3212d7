import { Migration } from '@mikro-orm/migrations';

/** Sessions end when the password changes: users carry a session version the session cookie must match. */
export class Migration20261202023345 extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "users" add column "session_version" int not null default 0;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "users" drop column "session_version";`);
  }
}
