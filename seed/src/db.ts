import { Client } from 'pg';

/** The one thing builders need from a database: run SQL with parameters, get rows back.
 * A TypeORM DataSource or EntityManager fits this shape, and so does `pgDb` below. */
export type Db = { query(sql: string, params?: unknown[]): Promise<any[]> };

export async function connectPg(url: string): Promise<Db & { close(): Promise<void> }> {
  const client = new Client({ connectionString: url });
  await client.connect();
  return {
    query: async (sql, params) => (await client.query(sql, params as unknown[])).rows,
    close: () => client.end(),
  };
}
