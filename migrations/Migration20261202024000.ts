import { Migration } from '@mikro-orm/migrations';

/** A phone (one push endpoint) can follow the alerts of several kitchens: unique per endpoint and kitchen. */
export class Migration20261202024000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "push_subscriptions" drop constraint "push_subscriptions_endpoint_unique";`);
    this.addSql(`alter table "push_subscriptions" add constraint "push_subscriptions_endpoint_kitchen_id_unique" unique ("endpoint", "kitchen_id");`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "push_subscriptions" drop constraint "push_subscriptions_endpoint_kitchen_id_unique";`);
    this.addSql(`alter table "push_subscriptions" add constraint "push_subscriptions_endpoint_unique" unique ("endpoint");`);
  }
}
