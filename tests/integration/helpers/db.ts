// Direct reads of the test database, to check what a request did or did not write.
import { QueryTypes, Sequelize } from 'sequelize';

let db: Sequelize | undefined;

/** A new connection to the test database that `npm test` made (its name and user from the env). */
export function testDatabase(): Sequelize {
  return new Sequelize({
    dialect: 'mariadb',
    host: process.env.DB_HOST ?? '127.0.0.1',
    port: Number(process.env.DB_PORT ?? 3307),
    database: process.env.DB_NAME ?? 'outturn_test',
    username: process.env.DB_USER ?? 'outturn',
    password: process.env.DB_PASSWORD,
    logging: false,
  });
}

function connection() {
  db ??= testDatabase();
  return db;
}

export async function count(table: string, where = '1=1', replacements: unknown[] = []): Promise<number> {
  const [row] = await connection().query<{ n: number | bigint }>(
    `SELECT COUNT(*) AS n FROM \`${table}\` WHERE ${where}`,
    {
      replacements,
      type: QueryTypes.SELECT,
    },
  );
  return Number(row.n);
}

export async function rows<T extends object>(sql: string, replacements: unknown[] = []): Promise<T[]> {
  return connection().query<T>(sql, { replacements, type: QueryTypes.SELECT });
}

/** A direct change of the test database, to set up a state the API cannot reach. */
export async function execute(sql: string, replacements: unknown[] = []): Promise<void> {
  await connection().query(sql, { replacements, type: QueryTypes.UPDATE });
}

export async function closeDb() {
  await db?.close();
  db = undefined;
}

/** One query on its own short-lived connection, for helpers used by files that never call closeDb. */
export async function rowsOnce<T extends object>(sql: string, replacements: unknown[] = []): Promise<T[]> {
  const once = testDatabase();
  try {
    return await once.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  } finally {
    await once.close();
  }
}
