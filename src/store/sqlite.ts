import type { Db } from "./db.ts";
import type { Param, Q, Sql } from "./sql.ts";

/**
 * The records' SQL on one better-sqlite3 connection. better-sqlite3 runs each statement
 * synchronously; a transaction here is a BEGIN … COMMIT whose body is async, so while one is open
 * every other statement on the connection waits its turn (otherwise another request's statement,
 * run between two awaits, would land inside it). Across processes SQLite's own locks serialize
 * writers: BEGIN IMMEDIATE takes the write lock first, waiting up to the busy timeout.
 */
export function sqliteSql(db: Db): Sql {
  interface Statement {
    get(...params: Param[]): unknown;
    all(...params: Param[]): unknown[];
    run(...params: Param[]): { changes: number };
  }
  const statements = new Map<string, Statement>();
  const prepare = (sql: string): Statement => {
    let s = statements.get(sql);
    if (!s) {
      s = db.prepare(sql) as unknown as Statement;
      statements.set(sql, s);
    }
    return s;
  };
  const direct: Q = {
    get: async <T>(sql: string, ...params: Param[]) => prepare(sql).get(...params) as T | undefined,
    all: async <T>(sql: string, ...params: Param[]) => prepare(sql).all(...params) as T[],
    run: async (sql: string, ...params: Param[]) => ({ changes: prepare(sql).run(...params).changes }),
  };

  // Transactions queue one behind another; `open` while one holds the connection.
  let tail: Promise<unknown> = Promise.resolve();
  let open = false;
  const inTurn = <T>(fn: () => Promise<T>): Promise<T> => {
    const result = tail.then(fn);
    tail = result.catch(() => undefined);
    return result;
  };
  const outside = <A extends unknown[], R>(f: (...a: A) => Promise<R>) => {
    return (...a: A): Promise<R> => (open ? inTurn(() => f(...a)) : f(...a));
  };
  const transaction = <T>(begin: string, fn: (q: Q) => Promise<T>): Promise<T> =>
    inTurn(async () => {
      db.exec(begin);
      open = true;
      try {
        const value = await fn(direct);
        db.exec("COMMIT");
        return value;
      } catch (err) {
        if (db.inTransaction) db.exec("ROLLBACK");
        throw err;
      } finally {
        open = false;
      }
    });

  return {
    dialect: "sqlite",
    get: outside(direct.get) as Q["get"],
    all: outside(direct.all) as Q["all"],
    run: outside(direct.run),
    write: (fn) => transaction("BEGIN IMMEDIATE", fn),
    read: (fn) => transaction("BEGIN", fn),
    close: () =>
      inTurn(async () => {
        if (db.open) db.close();
      }),
  };
}
