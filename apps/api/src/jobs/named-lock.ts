import type { Pool, RowDataPacket } from 'mysql2/promise';

/**
 * Runs `work` while holding the MariaDB named lock `name` on one connection; returns
 * undefined without running it when another instance holds the lock.
 */
export async function withNamedLock<T>(pool: Pool, name: string, work: () => Promise<T>): Promise<T | undefined> {
  const connection = await pool.getConnection();
  try {
    const [rows] = await connection.query<RowDataPacket[]>('SELECT GET_LOCK(?, 0) AS got', [name]);
    if (rows[0]?.got !== 1) return undefined;
    try {
      return await work();
    } finally {
      await connection.query('SELECT RELEASE_LOCK(?)', [name]);
    }
  } finally {
    connection.release();
  }
}
