// Multi-row INSERTs for the fleet generator: rows are buffered per table and sent as
// `INSERT INTO t (…) VALUES (…), (…), …` of a thousand rows, a few statements at a time, while
// the generator goes on computing. Column names and value mapping (JSON, dates) come from the
// Drizzle schema, so the rows are what the API's own inserts write.
import { getTableColumns, getTableName } from 'drizzle-orm';
import type { MySqlTable } from 'drizzle-orm/mysql-core';
import type { Pool, PoolConnection } from 'mysql2/promise';

const chunkRows = 1000;

export class BulkSink {
  private readonly buffers = new Map<MySqlTable, Record<string, unknown>[]>();
  private readonly inFlight = new Set<Promise<void>>();
  private readonly idle: PoolConnection[] = [];
  private failure: unknown;
  rowsWritten = 0;

  private constructor(
    private readonly connections: PoolConnection[],
  ) {
    this.idle.push(...connections);
  }

  /**
   * Takes `parallel` connections from the pool. Foreign-key and unique checks are off on them
   * while the fleet loads (as a dump's restore does), so tables can be filled in any order; the
   * generator assigns every id and key itself and only points at rows it made. The database's
   * triggers still run.
   */
  static async open(pool: Pool, parallel = 3): Promise<BulkSink> {
    const connections = await Promise.all(Array.from({ length: parallel }, () => pool.getConnection()));
    for (const c of connections) await c.query('SET SESSION foreign_key_checks = 0, unique_checks = 0');
    return new BulkSink(connections);
  }

  add<T extends MySqlTable>(table: T, row: T['$inferInsert']): void {
    let buffer = this.buffers.get(table);
    if (!buffer) this.buffers.set(table, (buffer = []));
    buffer.push(row as Record<string, unknown>);
    if (buffer.length >= chunkRows) {
      this.buffers.set(table, []);
      this.send(table, buffer);
    }
  }

  addAll<T extends MySqlTable>(table: T, rows: Array<T['$inferInsert']>): void {
    for (const row of rows) this.add(table, row);
  }

  /** Waits until at most `limit` statements are in flight (back-pressure for the generator). */
  async drain(limit = this.connections.length): Promise<void> {
    while (this.inFlight.size > limit) await Promise.race(this.inFlight);
    if (this.failure) throw this.failure;
  }

  /** Sends what is buffered of the tables named (all when none) and waits for everything. */
  async flush(...tables: MySqlTable[]): Promise<void> {
    for (const [table, rows] of this.buffers) {
      if (tables.length && !tables.includes(table)) continue;
      if (rows.length) this.send(table, rows);
      this.buffers.set(table, []);
    }
    while (this.inFlight.size) await Promise.race(this.inFlight);
    if (this.failure) throw this.failure;
  }

  async close(): Promise<void> {
    await this.flush();
    for (const c of this.connections) {
      await c.query('SET SESSION foreign_key_checks = 1, unique_checks = 1');
      c.release();
    }
  }

  private send(table: MySqlTable, rows: Record<string, unknown>[]): void {
    const columns = Object.entries(getTableColumns(table)).filter(([key, column]) => !column.generated && rows.some((r) => r[key] !== undefined));
    const names = columns.map(([, column]) => `\`${column.name}\``).join(', ');
    const values = rows.map((row) =>
      columns.map(([key, column]) => {
        const value = row[key];
        return value === undefined || value === null ? null : column.mapToDriverValue(value);
      }),
    );
    const statement = `INSERT INTO \`${getTableName(table)}\` (${names}) VALUES ?`;
    const task = (async () => {
      while (this.idle.length === 0) await Promise.race(this.inFlight);
      const connection = this.idle.pop()!;
      try {
        await connection.query(statement, [values]);
        this.rowsWritten += rows.length;
      } catch (error) {
        this.failure ??= error;
      } finally {
        this.idle.push(connection);
      }
    })();
    this.inFlight.add(task);
    void task.finally(() => this.inFlight.delete(task));
  }
}
