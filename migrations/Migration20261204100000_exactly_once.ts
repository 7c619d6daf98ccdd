import { Migration } from '@mikro-orm/migrations';

// What must exist once is held by the database as well as by the services, so two requests at the same
// moment cannot both pass a check and both insert:
// - a label names one fitted (not removed) group per asset;
// - a group has at most one renewal booked by a planner (confirmed or ordered);
// - a fitted renewal made one new group (a group replaces another at most once, a renewal names one new group);
// - an address has one live (not accepted, not revoked) invitation per organisation;
// - a write sent with an idempotency key is done once per key and user (idempotency_key).
// Rows that already break a rule are repaired first without deleting anything: a later duplicate group is
// closed (a fitted copy) or renamed with a number, a later booked renewal is cancelled with a note, an
// older open invitation is revoked.
export class Migration20261204100000_exactly_once extends Migration {

  override async up(): Promise<void> {
    // A renewal recorded as fitted twice made two new groups: keep the first, close the others as duplicates.
    this.addSql(`with ranked as (
      select id, replaces_group_id, row_number() over (partition by replaces_group_id order by created_at, id) as n
      from anode_group where replaces_group_id is not null)
    update anode_group g set
      removed_on = coalesce(g.removed_on, g.installed_on),
      removal_reason = coalesce(g.removal_reason, 'Recorded twice; closed as a duplicate'),
      notes = concat_ws(E'\\n', g.notes, 'Duplicate record of the renewal of group ' || r.replaces_group_id::text),
      replaces_group_id = null
    from ranked r where r.id = g.id and r.n > 1;`);
    this.addSql(`with ranked as (
      select id, row_number() over (partition by new_group_id order by updated_at, id) as n
      from renewal where new_group_id is not null)
    update renewal r set new_group_id = null, notes = concat_ws(E'\\n', r.notes, 'Duplicate record; the first one keeps the new group')
    from ranked k where k.id = r.id and k.n > 1;`);
    // Two fitted groups on one asset with one label: the later ones get a number after the label.
    this.addSql(`with ranked as (
      select id, row_number() over (partition by asset_id, label order by created_at, id) as n
      from anode_group where removed_on is null)
    update anode_group g set label = left(g.label, 48) || ' (copy ' || r.n || ')'
    from ranked r where r.id = g.id and r.n > 1;`);
    // Two renewals booked for one group: the later ones are cancelled, with a note that says why.
    this.addSql(`with ranked as (
      select id, row_number() over (partition by group_id order by created_at, id) as n
      from renewal where status in ('confirmed', 'ordered'))
    update renewal r set status = 'cancelled', notes = concat_ws(E'\\n', r.notes, 'Cancelled: the group was booked twice')
    from ranked k where k.id = r.id and k.n > 1;`);
    // Two open invitations for one address: the newest stays open.
    this.addSql(`with ranked as (
      select id, row_number() over (partition by organisation_id, email order by created_at desc, id desc) as n
      from invitation where accepted_at is null and revoked_at is null)
    update invitation i set revoked_at = now() from ranked r where r.id = i.id and r.n > 1;`);

    this.addSql(`create unique index "anode_group_live_label_unique" on "anode_group" ("asset_id", "label") where "removed_on" is null;`);
    this.addSql(`create unique index "anode_group_replaces_group_id_unique" on "anode_group" ("replaces_group_id") where "replaces_group_id" is not null;`);
    this.addSql(`create unique index "renewal_new_group_id_unique" on "renewal" ("new_group_id") where "new_group_id" is not null;`);
    this.addSql(`create unique index "renewal_booked_group_unique" on "renewal" ("group_id") where "status" in ('confirmed', 'ordered');`);
    this.addSql(`create unique index "invitation_live_email_unique" on "invitation" ("organisation_id", "email") where "accepted_at" is null and "revoked_at" is null;`);

    // The first result of a write, by the key its form or request carried: a repeat returns it instead of writing again.
    this.addSql(`create table "idempotency_key" ("owner" varchar(64) not null, "key" varchar(64) not null, "fingerprint" varchar(64) not null, "result" jsonb null, "created_at" timestamptz not null default now(), constraint "idempotency_key_pkey" primary key ("owner", "key"));`);
    this.addSql(`create index "idempotency_key_created_at_index" on "idempotency_key" ("created_at");`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "idempotency_key" cascade;`);
    this.addSql(`drop index if exists "invitation_live_email_unique";`);
    this.addSql(`drop index if exists "renewal_booked_group_unique";`);
    this.addSql(`drop index if exists "renewal_new_group_id_unique";`);
    this.addSql(`drop index if exists "anode_group_replaces_group_id_unique";`);
    this.addSql(`drop index if exists "anode_group_live_label_unique";`);
  }

}
