import { sql, type Kysely } from 'kysely';

// Each unit's no-cooling visits, kept beside the entries so the attention lists' "no cooling
// twice within 90 days" reads the few units whose second-latest such visit is recent, instead of
// grouping every entry of every recent no-cooling visit on each request.
//
// One row per unit and audience, mirroring visitVisibleTo (lib/auth/scope.ts) as the list reads
// it (a visit counts for a unit when any entry of that visit names the unit):
// - client_id null: staff, who see every visit of their company's sites, open ones included;
// - client_id set: that client's owners, who see only closed visits on their own client's sites.
// A visit counts however its entries stand (voided too), as in the list's own query. The window
// (90 days before today) moves with the clock, so the rows keep every no-cooling visit with its
// start, ordered latest first, and second_started_at (the start of the second latest) for the
// index; the reader keeps the visits inside the window. Triggers refresh the rows of every unit
// touched, in the same transaction: an entry added, moved to another unit or visit, or deleted; a
// visit whose reason, status, site or start changed; a site given to another client or company.

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table no_cooling_visits (
      equipment_id uuid not null references equipment (id) on delete cascade,
      company_id uuid not null references companies (id) on delete cascade,
      client_id uuid references clients (id) on delete cascade,
      visit_ids uuid[] not null,
      started_ats timestamptz[] not null,
      second_started_at timestamptz,
      constraint no_cooling_visits_unit_audience unique nulls not distinct (equipment_id, company_id, client_id)
    )`.execute(db);
  // The lists read only the units with two such visits, the second one recent.
  await sql`create index no_cooling_visits_recent_idx on no_cooling_visits (company_id, client_id, second_started_at) where second_started_at is not null`.execute(db);

  await sql`
    create function refresh_no_cooling_visits(units uuid[]) returns void language plpgsql as $$
    declare unit uuid;
    begin
      -- One writer per unit at a time, in a fixed order (as refresh_condition_trends does).
      foreach unit in array coalesce((select array_agg(distinct x order by x) from unnest(units) as x), '{}') loop
        perform pg_advisory_xact_lock(hashtextextended('no_cooling_visits:' || unit::text, 0));
      end loop;
      delete from no_cooling_visits where equipment_id = any(units);
      -- Staff: every no-cooling visit on their company's sites.
      insert into no_cooling_visits (equipment_id, company_id, client_id, visit_ids, started_ats, second_started_at)
      select u.equipment_id, s.company_id, null,
        array_agg(v.id order by v.started_at desc, v.id), array_agg(v.started_at order by v.started_at desc, v.id),
        (array_agg(v.started_at order by v.started_at desc, v.id))[2]
      from (select distinct e.equipment_id, e.visit_id from entries e where e.equipment_id = any(units)) u
      join visits v on v.id = u.visit_id and v.reason = 'no_cooling'
      join sites s on s.id = v.site_id
      group by u.equipment_id, s.company_id;
      -- Owners: closed no-cooling visits, per client of the visit's site.
      insert into no_cooling_visits (equipment_id, company_id, client_id, visit_ids, started_ats, second_started_at)
      select u.equipment_id, s.company_id, s.client_id,
        array_agg(v.id order by v.started_at desc, v.id), array_agg(v.started_at order by v.started_at desc, v.id),
        (array_agg(v.started_at order by v.started_at desc, v.id))[2]
      from (select distinct e.equipment_id, e.visit_id from entries e where e.equipment_id = any(units)) u
      join visits v on v.id = u.visit_id and v.reason = 'no_cooling' and v.status = 'closed'
      join sites s on s.id = v.site_id
      where s.client_id is not null
      group by u.equipment_id, s.company_id, s.client_id;
    end $$`.execute(db);

  // Statement triggers with transition tables: a bulk insert refreshes each unit once, and only
  // entries on no-cooling visits (before or after the change) cost anything.
  await sql`
    create function no_cooling_visits_from_entries() returns trigger language plpgsql as $$
    declare units uuid[];
    begin
      if tg_op = 'INSERT' then
        select array_agg(distinct n.equipment_id) into units from new_rows n join visits v on v.id = n.visit_id
        where v.reason = 'no_cooling' and n.equipment_id is not null;
      elsif tg_op = 'DELETE' then
        select array_agg(distinct o.equipment_id) into units from old_rows o join visits v on v.id = o.visit_id
        where v.reason = 'no_cooling' and o.equipment_id is not null;
      else
        select array_agg(distinct x.id) into units from (
          select o.equipment_id as id, o.visit_id as old_visit, n.visit_id as new_visit from old_rows o join new_rows n on n.id = o.id
          where (o.equipment_id, o.visit_id) is distinct from (n.equipment_id, n.visit_id)
          union all
          select n.equipment_id, o.visit_id, n.visit_id from old_rows o join new_rows n on n.id = o.id
          where (o.equipment_id, o.visit_id) is distinct from (n.equipment_id, n.visit_id)
        ) x
        where x.id is not null
          and exists (select 1 from visits v where v.id in (x.old_visit, x.new_visit) and v.reason = 'no_cooling');
      end if;
      if units is not null then perform refresh_no_cooling_visits(units); end if;
      return null;
    end $$`.execute(db);
  await sql`create trigger entries_no_cooling_visits_insert after insert on entries referencing new table as new_rows for each statement execute function no_cooling_visits_from_entries()`.execute(db);
  await sql`create trigger entries_no_cooling_visits_update after update on entries referencing old table as old_rows new table as new_rows for each statement execute function no_cooling_visits_from_entries()`.execute(db);
  await sql`create trigger entries_no_cooling_visits_delete after delete on entries referencing old table as old_rows for each statement execute function no_cooling_visits_from_entries()`.execute(db);

  // A visit given or relieved of the reason, closed or reopened, moved to another site or start.
  await sql`
    create function no_cooling_visits_from_visits() returns trigger language plpgsql as $$
    declare units uuid[];
    begin
      select array_agg(distinct e.equipment_id) into units
      from old_rows o join new_rows n on n.id = o.id
      join entries e on e.visit_id = n.id
      where (o.reason = 'no_cooling' or n.reason = 'no_cooling')
        and (o.reason, o.status, o.site_id, o.started_at) is distinct from (n.reason, n.status, n.site_id, n.started_at)
        and e.equipment_id is not null;
      if units is not null then perform refresh_no_cooling_visits(units); end if;
      return null;
    end $$`.execute(db);
  await sql`create trigger visits_no_cooling_visits after update on visits referencing old table as old_rows new table as new_rows for each statement execute function no_cooling_visits_from_visits()`.execute(db);

  // A site given to another client (or company): the units named on its no-cooling visits.
  await sql`
    create function no_cooling_visits_from_sites() returns trigger language plpgsql as $$
    declare units uuid[];
    begin
      select array_agg(distinct e.equipment_id) into units
      from old_rows o join new_rows n on n.id = o.id
      join visits v on v.site_id = n.id and v.reason = 'no_cooling'
      join entries e on e.visit_id = v.id
      where (o.client_id, o.company_id) is distinct from (n.client_id, n.company_id) and e.equipment_id is not null;
      if units is not null then perform refresh_no_cooling_visits(units); end if;
      return null;
    end $$`.execute(db);
  await sql`create trigger sites_no_cooling_visits after update on sites referencing old table as old_rows new table as new_rows for each statement execute function no_cooling_visits_from_sites()`.execute(db);

  // The visits already recorded.
  await sql`
    select refresh_no_cooling_visits(array(
      select distinct e.equipment_id from entries e join visits v on v.id = e.visit_id
      where v.reason = 'no_cooling' and e.equipment_id is not null))`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop trigger if exists sites_no_cooling_visits on sites`.execute(db);
  await sql`drop function if exists no_cooling_visits_from_sites()`.execute(db);
  await sql`drop trigger if exists visits_no_cooling_visits on visits`.execute(db);
  await sql`drop function if exists no_cooling_visits_from_visits()`.execute(db);
  await sql`drop trigger if exists entries_no_cooling_visits_delete on entries`.execute(db);
  await sql`drop trigger if exists entries_no_cooling_visits_update on entries`.execute(db);
  await sql`drop trigger if exists entries_no_cooling_visits_insert on entries`.execute(db);
  await sql`drop function if exists no_cooling_visits_from_entries()`.execute(db);
  await sql`drop function if exists refresh_no_cooling_visits(uuid[])`.execute(db);
  await sql`drop table if exists no_cooling_visits`.execute(db);
}
