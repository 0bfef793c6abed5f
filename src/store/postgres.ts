import pg from "pg";
import { DatabaseUnreachableError } from "./health.ts";
import { PG_MIGRATIONS } from "./pgMigrations.ts";
import { SCHEMA_VERSION } from "./migrations.ts";
import type { Param, Q, Sql } from "./sql.ts";

/**
 * The records' SQL on a PostgreSQL server through node-postgres, when DATABASE_URL is set.
 *
 * Writers are serialized as SQLite serializes them: every write transaction first takes one
 * transaction-level advisory lock of the records' schema, so the rules judged inside it (the next
 * revision number, the sign-off order, a free calculation number or name, the guess count) see
 * every write committed before, in this process or any other server sharing the database.
 * Saves and sign-offs come at human pace, so one writer at a time costs nothing that matters;
 * reads take no lock and see one snapshot (REPEATABLE READ) each.
 */

/** The advisory-lock namespace of Hoopwise (the first key); the second is the schema's name hashed. */
const LOCK_SPACE = 0x686f6f70; // "hoop"
const LOCK = `SELECT pg_advisory_xact_lock(${LOCK_SPACE}, hashtext(current_schema()))`;

export interface PostgresOptions {
  connectionString: string;
  /** A schema to keep the records in instead of the connection's default (`public`); the tests give each store its own. */
  schema?: string;
  /** Connections kept open at most (default 10). */
  maxConnections?: number;
}

const SCHEMA_NAME = /^[a-z_][a-z0-9_]{0,62}$/;

// BIGINT (counts, event ids, times in ms) as a JavaScript number: every value the records keep is
// far below 2^53.
const INT8 = 20;
const types = {
  getTypeParser: ((oid: number, format?: "text" | "binary") =>
    oid === INT8 && format !== "binary" ? (v: string) => Number(v) : pg.types.getTypeParser(oid, format)) as typeof pg.types.getTypeParser,
};

export async function openPostgres(options: PostgresOptions): Promise<Sql> {
  if (options.schema !== undefined && !SCHEMA_NAME.test(options.schema)) throw new Error(`"${options.schema}" is not a usable schema name`);
  const pool = new pg.Pool({
    connectionString: options.connectionString,
    max: options.maxConnections ?? 10,
    options: options.schema ? `-c search_path=${options.schema}` : undefined,
    types,
    // A server that does not answer is a fault to report, not a request to hang on.
    connectionTimeoutMillis: 10_000,
    application_name: "hoopwise",
  });
  // An idle connection the server drops (a restart) must not take the process down; the next
  // query opens a new one, or fails with a storage fault the routes answer 503 to.
  pool.on("error", (err) => console.error(`records database: idle connection lost: ${err.message}`));

  const numbered = new Map<string, string>();
  const text = (sql: string) => {
    let t = numbered.get(sql);
    if (t === undefined) {
      let i = 0;
      t = sql.replace(/\?/g, () => `$${++i}`);
      numbered.set(sql, t);
    }
    return t;
  };
  const query = async (c: pg.Pool | pg.PoolClient, sql: string, params: Param[]) => {
    try {
      return await c.query(text(sql), params);
    } catch (err) {
      throw fault(err);
    }
  };
  const on = (c: pg.Pool | pg.PoolClient): Q => ({
    get: async <T>(sql: string, ...params: Param[]) => (await query(c, sql, params)).rows[0] as T | undefined,
    all: async <T>(sql: string, ...params: Param[]) => (await query(c, sql, params)).rows as T[],
    run: async (sql: string, ...params: Param[]) => ({ changes: (await query(c, sql, params)).rowCount ?? 0 }),
  });
  const transaction = async <T>(begin: string[], fn: (q: Q) => Promise<T>): Promise<T> => {
    const client = await pool.connect().catch((err: unknown) => {
      throw fault(err);
    });
    let broken: Error | undefined;
    try {
      for (const b of begin) await query(client, b, []);
      const value = await fn(on(client));
      await query(client, "COMMIT", []);
      return value;
    } catch (err) {
      await client.query("ROLLBACK").catch((e: Error) => {
        broken = e;
      });
      throw err;
    } finally {
      client.release(broken);
    }
  };

  const sql: Sql = {
    dialect: "postgres",
    ...on(pool),
    write: (fn) => transaction(["BEGIN", LOCK], fn),
    read: (fn) => transaction(["BEGIN ISOLATION LEVEL REPEATABLE READ READ ONLY"], fn),
    close: async () => {
      if (!pool.ended && !pool.ending) await pool.end();
    },
  };
  try {
    await migratePostgres(pool);
  } catch (err) {
    await pool.end().catch(() => undefined);
    throw err;
  }
  return sql;
}

/**
 * Apply every migration newer than the schema's recorded version, all in one transaction under the
 * writers' lock, so servers starting together apply each once. Running it again changes nothing.
 */
export async function migratePostgres(pool: pg.Pool): Promise<void> {
  const client = await pool.connect().catch((err: unknown) => {
    throw fault(err);
  });
  try {
    await client.query("BEGIN");
    const schema = (await client.query("SELECT current_schema() AS s")).rows[0]?.s as string | null;
    if (!schema) throw new Error("the records database has no schema to work in (is the search_path's schema created?)");
    await client.query(LOCK);
    await client.query("CREATE TABLE IF NOT EXISTS schema_version (version INTEGER PRIMARY KEY, applied_at TEXT NOT NULL)");
    const found = Number((await client.query("SELECT coalesce(max(version), 0) AS v FROM schema_version")).rows[0].v);
    if (found > SCHEMA_VERSION) {
      throw new Error(
        `the records database has schema version ${found}, newer than this build of Hoopwise understands (${SCHEMA_VERSION}); ` +
          "update Hoopwise rather than let an older build write to it",
      );
    }
    for (const m of PG_MIGRATIONS) {
      if (m.version <= found) continue;
      await client.query(m.sql);
      await client.query("INSERT INTO schema_version (version, applied_at) VALUES ($1, $2)", [m.version, new Date().toISOString()]);
    }
    await client.query("COMMIT");
  } catch (err) {
    await client.query("ROLLBACK").catch(() => undefined);
    throw err;
  } finally {
    client.release();
  }
}

/** A server's own error as it is; a lost or refused connection, which has no SQLSTATE, as a DatabaseUnreachableError. */
function fault(err: unknown): unknown {
  if (err instanceof pg.DatabaseError || !(err instanceof Error)) return err;
  return new DatabaseUnreachableError(err);
}
