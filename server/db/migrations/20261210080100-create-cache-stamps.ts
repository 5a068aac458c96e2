import type { QueryInterface } from 'sequelize'

// Several app processes, on one machine or many, share this database and keep caches in memory.
// Each organisation has one row of stamps that the database itself moves on whenever what a cache
// holds changes, whoever writes (the app, a script, a seeder): the published knowledge-base
// version, a generation of confirmed causes on closed cases (the learned priors) and a generation
// of the equipment register (units with their stages, sites and customers). Caches key their
// entries by these stamps, so a change made through one process is seen by every other at once.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.sequelize.query(`
    CREATE TABLE organisation_cache_stamps (
      organisation_id integer PRIMARY KEY REFERENCES organisations (id) ON DELETE CASCADE,
      published_kb_version_id integer,
      learned_generation bigint NOT NULL DEFAULT 0,
      equipment_generation bigint NOT NULL DEFAULT 0
    )`)
  await qi.sequelize.query(`
    CREATE FUNCTION bump_cache_stamp(org integer, what text) RETURNS void LANGUAGE plpgsql AS $$
    BEGIN
      INSERT INTO organisation_cache_stamps (organisation_id) VALUES (org) ON CONFLICT (organisation_id) DO NOTHING;
      IF what = 'knowledge' THEN
        UPDATE organisation_cache_stamps SET published_kb_version_id = (
          SELECT id FROM kb_versions WHERE organisation_id = org AND status = 'published'
           ORDER BY published_at DESC NULLS LAST, id DESC LIMIT 1)
         WHERE organisation_id = org;
      ELSIF what = 'learned' THEN
        UPDATE organisation_cache_stamps SET learned_generation = learned_generation + 1 WHERE organisation_id = org;
      ELSE
        UPDATE organisation_cache_stamps SET equipment_generation = equipment_generation + 1 WHERE organisation_id = org;
      END IF;
    END $$`)
  // One trigger function per table: TG_ARGV names what moves; NEW or OLD names the organisation.
  await qi.sequelize.query(`
    CREATE FUNCTION cache_stamp_by_organisation() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP <> 'INSERT' THEN PERFORM bump_cache_stamp(OLD.organisation_id, TG_ARGV[0]); END IF;
      IF TG_OP <> 'DELETE' AND (TG_OP = 'INSERT' OR NEW.organisation_id IS DISTINCT FROM OLD.organisation_id) THEN
        PERFORM bump_cache_stamp(NEW.organisation_id, TG_ARGV[0]);
      END IF;
      RETURN NULL;
    END $$`)
  await qi.sequelize.query(`
    CREATE FUNCTION cache_stamp_by_unit() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM bump_cache_stamp(u.organisation_id, 'equipment') FROM units u
        WHERE u.id IN (CASE WHEN TG_OP = 'INSERT' THEN NULL ELSE OLD.unit_id END, CASE WHEN TG_OP = 'DELETE' THEN NULL ELSE NEW.unit_id END);
      RETURN NULL;
    END $$`)
  await qi.sequelize.query(`
    CREATE TRIGGER kb_versions_cache_stamp AFTER INSERT OR DELETE OR UPDATE OF status, published_at, organisation_id ON kb_versions
      FOR EACH ROW EXECUTE FUNCTION cache_stamp_by_organisation('knowledge')`)
  // Only closing, reopening or changing confirmed causes moves the learned priors; the hot path of
  // readings and outcomes (which sets other columns) fires nothing.
  await qi.sequelize.query(`
    CREATE TRIGGER cases_cache_stamp_update AFTER UPDATE OF status, confirmed_causes, unit_id ON cases
      FOR EACH ROW WHEN (OLD.status = 'closed' OR NEW.status = 'closed') EXECUTE FUNCTION cache_stamp_by_organisation('learned')`)
  await qi.sequelize.query(`
    CREATE TRIGGER cases_cache_stamp_insert AFTER INSERT ON cases
      FOR EACH ROW WHEN (NEW.status = 'closed') EXECUTE FUNCTION cache_stamp_by_organisation('learned')`)
  await qi.sequelize.query(`
    CREATE TRIGGER cases_cache_stamp_delete AFTER DELETE ON cases
      FOR EACH ROW WHEN (OLD.status = 'closed') EXECUTE FUNCTION cache_stamp_by_organisation('learned')`)
  for (const table of ['units', 'sites', 'customers']) {
    await qi.sequelize.query(`
      CREATE TRIGGER ${table}_cache_stamp AFTER INSERT OR UPDATE OR DELETE ON ${table}
        FOR EACH ROW EXECUTE FUNCTION cache_stamp_by_organisation('equipment')`)
  }
  await qi.sequelize.query(`
    CREATE TRIGGER unit_stages_cache_stamp AFTER INSERT OR UPDATE OR DELETE ON unit_stages
      FOR EACH ROW EXECUTE FUNCTION cache_stamp_by_unit()`)
  await qi.sequelize.query(`
    INSERT INTO organisation_cache_stamps (organisation_id, published_kb_version_id)
    SELECT o.id, (SELECT id FROM kb_versions v WHERE v.organisation_id = o.id AND v.status = 'published'
                   ORDER BY published_at DESC NULLS LAST, id DESC LIMIT 1)
      FROM organisations o`)
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const [trigger, table] of [
    ['kb_versions_cache_stamp', 'kb_versions'], ['cases_cache_stamp_update', 'cases'], ['cases_cache_stamp_insert', 'cases'],
    ['cases_cache_stamp_delete', 'cases'], ['units_cache_stamp', 'units'], ['sites_cache_stamp', 'sites'],
    ['customers_cache_stamp', 'customers'], ['unit_stages_cache_stamp', 'unit_stages'],
  ]) await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${trigger} ON ${table}`)
  await qi.sequelize.query('DROP FUNCTION IF EXISTS cache_stamp_by_unit(); DROP FUNCTION IF EXISTS cache_stamp_by_organisation(); DROP FUNCTION IF EXISTS bump_cache_stamp(integer, text)')
  await qi.dropTable('organisation_cache_stamps')
}
