import { Migration } from '@mikro-orm/migrations';

// The owner's renewal threshold: renew a group when less than this percentage of its original anode mass
// remains (the forecast's renew-by date). Existing organisations get 25 %, the default of the forecast.
export class Migration20261203100000_renewal_threshold extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "organisation" add column "renewal_threshold_percent" int not null default 25;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "organisation" drop column "renewal_threshold_percent";`);
  }

}
