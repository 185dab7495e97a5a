import type pg from "pg";

// Hands a database made by an older launcher (owned, with everything in it, by the cluster's
// superuser) over to the app's role. REASSIGN OWNED cannot be used: the superuser made by initdb
// also owns the system catalogs ("cannot reassign ownership of objects owned by role … because
// they are required by the database system", PostgreSQL 15 manual, REASSIGN OWNED), so each of
// our own objects is altered one by one. Extension members stay with the extension.

const OWN_OBJECTS = `
DO $$
DECLARE
  old oid := (SELECT oid FROM pg_roles WHERE rolname = %L);
  r record;
BEGIN
  FOR r IN
    SELECT n.nspname FROM pg_namespace n
    WHERE n.nspowner = old AND n.nspname NOT LIKE 'pg\\_%%' AND n.nspname <> 'information_schema'
  LOOP
    EXECUTE format('ALTER SCHEMA %%I OWNER TO %%I', r.nspname, %L);
  END LOOP;
  -- tables, partitions, views; sequences only when no column owns them (those follow their table)
  FOR r IN
    SELECT c.oid::regclass::text AS name, c.relkind FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
    WHERE c.relowner = old AND n.nspname NOT LIKE 'pg\\_%%' AND n.nspname <> 'information_schema'
      AND c.relkind IN ('r', 'p', 'v', 'm', 'f', 'S')
      AND NOT EXISTS (SELECT 1 FROM pg_depend d WHERE d.classid = 'pg_class'::regclass AND d.objid = c.oid
                      AND (d.deptype = 'e' OR (c.relkind = 'S' AND d.deptype IN ('a', 'i'))))
  LOOP
    EXECUTE format('ALTER %%s %%s OWNER TO %%I',
      CASE r.relkind WHEN 'S' THEN 'SEQUENCE' WHEN 'v' THEN 'VIEW' WHEN 'm' THEN 'MATERIALIZED VIEW' WHEN 'f' THEN 'FOREIGN TABLE' ELSE 'TABLE' END,
      r.name, %L);
  END LOOP;
  -- enum and domain types (Sequelize's ENUM columns); array types follow their element type
  FOR r IN
    SELECT t.oid::regtype::text AS name FROM pg_type t JOIN pg_namespace n ON n.oid = t.typnamespace
    WHERE t.typowner = old AND t.typtype IN ('e', 'd') AND n.nspname NOT LIKE 'pg\\_%%' AND n.nspname <> 'information_schema'
      AND NOT EXISTS (SELECT 1 FROM pg_depend d WHERE d.classid = 'pg_type'::regclass AND d.objid = t.oid AND d.deptype = 'e')
  LOOP
    EXECUTE format('ALTER TYPE %%s OWNER TO %%I', r.name, %L);
  END LOOP;
  -- functions (pg-boss's queue functions)
  FOR r IN
    SELECT p.oid::regprocedure::text AS name FROM pg_proc p JOIN pg_namespace n ON n.oid = p.pronamespace
    WHERE p.proowner = old AND n.nspname NOT LIKE 'pg\\_%%' AND n.nspname <> 'information_schema'
      AND NOT EXISTS (SELECT 1 FROM pg_depend d WHERE d.classid = 'pg_proc'::regclass AND d.objid = p.oid AND d.deptype = 'e')
  LOOP
    EXECUTE format('ALTER ROUTINE %%s OWNER TO %%I', r.name, %L);
  END LOOP;
END
$$`;

/** Run on a connection to `database` as the superuser. */
export async function handOverDatabase(client: pg.Client, opts: { database: string; from: string; to: string }): Promise<void> {
  const ident = (s: string) => `"${s.replace(/"/g, '""')}"`;
  await client.query("BEGIN");
  try {
    await client.query(`ALTER DATABASE ${ident(opts.database)} OWNER TO ${ident(opts.to)}`);
    // format() fills the role names in as literals (%L), so the block needs no string building of ours
    const { rows } = await client.query<{ sql: string }>("SELECT format($1, $2::text, $3::text, $3::text, $3::text, $3::text) AS sql", [
      OWN_OBJECTS,
      opts.from,
      opts.to,
    ]);
    await client.query(rows[0].sql);
    await client.query("COMMIT");
  } catch (error) {
    await client.query("ROLLBACK");
    throw error;
  }
}
