import { sql, type Kysely } from 'kysely';

// The last two condition ratings of each unit, kept beside the entries so the attention lists'
// "condition worse at the last rating than at the one before" reads a handful of rows instead of
// ranking every rating the viewer may see on each request.
//
// One row per unit and audience, mirroring entryVisibleTo (lib/auth/scope.ts):
// - client_id null: staff, who see every rating of their company, open visits included;
// - client_id set: that client's owners, who see only ratings from closed visits on their own
//   client's sites (the visit's site, as the scope filter reads it).
// Voided ratings count for no one. Triggers refresh the rows of every unit touched, in the same
// transaction, whatever the path: an entry added, edited, voided or deleted; a visit closed,
// reopened or moved to another site; a site given to another client. A unit's own site plays no
// part (the lists join the visible units when they read), so moving a unit changes nothing here.

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table condition_trends (
      equipment_id uuid not null references equipment (id) on delete cascade,
      company_id uuid not null references companies (id) on delete cascade,
      client_id uuid references clients (id) on delete cascade,
      latest_rating int not null,
      latest_visit_id uuid not null,
      previous_rating int,
      constraint condition_trends_unit_audience unique nulls not distinct (equipment_id, client_id)
    )`.execute(db);
  // The lists read only the units whose condition got worse.
  await sql`create index condition_trends_worse_idx on condition_trends (company_id, client_id) include (equipment_id) where latest_rating < previous_rating`.execute(db);

  await sql`
    create function refresh_condition_trends(units uuid[]) returns void language plpgsql as $$
    declare unit uuid;
    begin
      -- One writer per unit at a time, in a fixed order: a second transaction rating the same unit
      -- waits for the first to commit and then reads its rating too (each statement below takes a
      -- fresh snapshot), instead of writing a stale pair or failing on the unique key.
      foreach unit in array coalesce((select array_agg(distinct x order by x) from unnest(units) as x), '{}') loop
        perform pg_advisory_xact_lock(hashtextextended('condition_trends:' || unit::text, 0));
      end loop;
      delete from condition_trends where equipment_id = any(units);
      -- Staff: every rating not voided.
      insert into condition_trends (equipment_id, company_id, client_id, latest_rating, latest_visit_id, previous_rating)
      select u.id, last2.company_id[1], null, last2.ratings[1], last2.visits[1], last2.ratings[2]
      from unnest(units) as u(id)
      cross join lateral (
        select array_agg(r.company_id) as company_id, array_agg(r.rating) as ratings, array_agg(r.visit_id) as visits
        from (
          select e.company_id, (e.data->>'rating')::int as rating, e.visit_id
          from entries e
          where e.equipment_id = u.id and e.kind = 'condition' and e.voided_at is null
          order by e.recorded_at desc, e.id desc
          limit 2
        ) r
      ) last2
      where last2.ratings is not null;
      -- Owners: ratings from closed visits, per client of the visit's site.
      insert into condition_trends (equipment_id, company_id, client_id, latest_rating, latest_visit_id, previous_rating)
      select r.equipment_id, r.company_id, r.client_id,
        max(r.rating) filter (where r.n = 1), (array_agg(r.visit_id) filter (where r.n = 1))[1], max(r.rating) filter (where r.n = 2)
      from (
        select e.equipment_id, e.company_id, s.client_id, e.visit_id, (e.data->>'rating')::int as rating,
          row_number() over (partition by e.equipment_id, e.company_id, s.client_id order by e.recorded_at desc, e.id desc) as n
        from entries e
        join visits v on v.id = e.visit_id
        join sites s on s.id = v.site_id
        where e.equipment_id = any(units) and e.kind = 'condition' and e.voided_at is null and v.status = 'closed'
      ) r
      where r.n <= 2
      group by r.equipment_id, r.company_id, r.client_id;
    end $$`.execute(db);

  // Statement triggers with transition tables: a bulk insert refreshes each unit once.
  await sql`
    create function condition_trends_from_entries() returns trigger language plpgsql as $$
    declare units uuid[];
    begin
      if tg_op = 'INSERT' then
        select array_agg(distinct n.equipment_id) into units from new_rows n where n.kind = 'condition' and n.equipment_id is not null;
      elsif tg_op = 'DELETE' then
        select array_agg(distinct o.equipment_id) into units from old_rows o where o.kind = 'condition' and o.equipment_id is not null;
      else
        select array_agg(distinct x.id) into units from (
          select o.equipment_id as id from old_rows o join new_rows n on n.id = o.id
          where (o.kind = 'condition' or n.kind = 'condition')
            and (o.kind, o.equipment_id, o.visit_id, o.company_id, o.data->'rating', o.recorded_at, o.voided_at)
              is distinct from (n.kind, n.equipment_id, n.visit_id, n.company_id, n.data->'rating', n.recorded_at, n.voided_at)
          union
          select n.equipment_id from old_rows o join new_rows n on n.id = o.id
          where (o.kind = 'condition' or n.kind = 'condition')
            and (o.kind, o.equipment_id, o.visit_id, o.company_id, o.data->'rating', o.recorded_at, o.voided_at)
              is distinct from (n.kind, n.equipment_id, n.visit_id, n.company_id, n.data->'rating', n.recorded_at, n.voided_at)
        ) x where x.id is not null;
      end if;
      if units is not null then perform refresh_condition_trends(units); end if;
      return null;
    end $$`.execute(db);
  await sql`create trigger entries_condition_trends_insert after insert on entries referencing new table as new_rows for each statement execute function condition_trends_from_entries()`.execute(db);
  await sql`create trigger entries_condition_trends_update after update on entries referencing old table as old_rows new table as new_rows for each statement execute function condition_trends_from_entries()`.execute(db);
  await sql`create trigger entries_condition_trends_delete after delete on entries referencing old table as old_rows for each statement execute function condition_trends_from_entries()`.execute(db);

  // A visit closed or reopened, or moved to another site: its rated units.
  await sql`
    create function condition_trends_from_visits() returns trigger language plpgsql as $$
    declare units uuid[];
    begin
      select array_agg(distinct e.equipment_id) into units
      from old_rows o join new_rows n on n.id = o.id
      join entries e on e.visit_id = n.id
      where (o.status, o.site_id) is distinct from (n.status, n.site_id) and e.kind = 'condition' and e.equipment_id is not null;
      if units is not null then perform refresh_condition_trends(units); end if;
      return null;
    end $$`.execute(db);
  await sql`create trigger visits_condition_trends after update on visits referencing old table as old_rows new table as new_rows for each statement execute function condition_trends_from_visits()`.execute(db);

  // A site given to another client: the units rated on its visits.
  await sql`
    create function condition_trends_from_sites() returns trigger language plpgsql as $$
    declare units uuid[];
    begin
      select array_agg(distinct e.equipment_id) into units
      from old_rows o join new_rows n on n.id = o.id
      join visits v on v.site_id = n.id
      join entries e on e.visit_id = v.id
      where o.client_id is distinct from n.client_id and e.kind = 'condition' and e.equipment_id is not null;
      if units is not null then perform refresh_condition_trends(units); end if;
      return null;
    end $$`.execute(db);
  await sql`create trigger sites_condition_trends after update on sites referencing old table as old_rows new table as new_rows for each statement execute function condition_trends_from_sites()`.execute(db);

  // The ratings already recorded.
  await sql`select refresh_condition_trends(array(select distinct equipment_id from entries where kind = 'condition' and equipment_id is not null))`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop trigger if exists sites_condition_trends on sites`.execute(db);
  await sql`drop function if exists condition_trends_from_sites()`.execute(db);
  await sql`drop trigger if exists visits_condition_trends on visits`.execute(db);
  await sql`drop function if exists condition_trends_from_visits()`.execute(db);
  await sql`drop trigger if exists entries_condition_trends_delete on entries`.execute(db);
  await sql`drop trigger if exists entries_condition_trends_update on entries`.execute(db);
  await sql`drop trigger if exists entries_condition_trends_insert on entries`.execute(db);
  await sql`drop function if exists condition_trends_from_entries()`.execute(db);
  await sql`drop function if exists refresh_condition_trends(uuid[])`.execute(db);
  await sql`drop table if exists condition_trends`.execute(db);
}
