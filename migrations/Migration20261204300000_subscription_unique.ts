import { Migration } from '@mikro-orm/migrations';

// One subscription at the payment service belongs to one organisation: a subscription id recorded twice
// (a webhook for the wrong organisation, a race between two checkouts) is refused by the database.
export class Migration20261204300000_subscription_unique extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "organisation" add constraint "organisation_stripe_subscription_id_unique" unique ("stripe_subscription_id");`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "organisation" drop constraint "organisation_stripe_subscription_id_unique";`);
  }

}
